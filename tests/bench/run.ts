import { benchNearby } from "./nearby";

// `npm run bench`: builds nothing itself; run `npm run build` first.
async function main(): Promise<void> {
  await benchNearby();
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
