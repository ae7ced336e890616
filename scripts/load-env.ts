import { existsSync } from "node:fs";

/** Loads .env into process.env for scripts run outside Next (which loads it itself). Values already set win. */
export function loadDotEnv(path = ".env"): void {
  if (existsSync(path)) process.loadEnvFile(path);
}
