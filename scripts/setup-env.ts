import { randomBytes } from "node:crypto";
import { copyFileSync, existsSync, readFileSync, writeFileSync } from "node:fs";

// First run: .env from .env.example, with a fresh random sign-in secret.
if (!existsSync(".env")) {
  copyFileSync(".env.example", ".env");
  const secret = randomBytes(32).toString("base64url");
  writeFileSync(".env", readFileSync(".env", "utf8").replace(/^BETTER_AUTH_SECRET=.*$/m, `BETTER_AUTH_SECRET=${secret}`));
  console.log("created .env from .env.example");
}
