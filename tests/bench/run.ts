import { benchNearby } from "./nearby";
import { benchPages } from "./pages";

// `npm run bench` (after `npm run build`): prints the nearby-search figures and the page figures.
// BENCH_ONLY=nearby or BENCH_ONLY=pages runs one part.
async function main(): Promise<void> {
  const only = process.env.BENCH_ONLY;
  if (!only || only === "nearby") await benchNearby();
  if (!only || only === "pages") {
    await benchPages([
      { name: "home", url: "/" },
      { name: "sign-in", url: "/sign-in" },
      { name: "planner", url: "/planner" },
      { name: "map", url: "/map?lat=-15.4167&lng=28.2833&radiusKm=50", map: true },
      { name: "safety", url: "/safety" },
    ]);
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
