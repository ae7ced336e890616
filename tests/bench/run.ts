import { benchNearby } from "./nearby";
import { benchPages } from "./pages";

// `npm run bench` (after `npm run build`, with the same NEXT_DIST_DIR): prints the nearby-search figures and the
// page figures. BENCH_ONLY=nearby or BENCH_ONLY=pages runs one part; BENCH_PAGES=home,map picks pages by name.
async function main(): Promise<void> {
  const only = process.env.BENCH_ONLY;
  if (!only || only === "nearby") await benchNearby();
  if (!only || only === "pages") {
    await benchPages([
      { name: "home", url: "/" },
      { name: "sign-in", url: "/sign-in" },
      { name: "planner", url: "/planner" },
      { name: "map", url: "/map?lat=-15.4167&lng=28.2833&radiusKm=50", map: true },
      { name: "hatchery", url: (ids) => `/providers/${ids.hatcheryId}` },
      { name: "builder", url: (ids) => `/providers/${ids.builderId}` },
      { name: "dashboard", url: "/dashboard", as: "farmer" },
      { name: "reservation", url: (ids) => `/farmer/reservations/${ids.reservationId}`, as: "farmer" },
      { name: "job", url: (ids) => `/farmer/requests/${ids.jobRequestId}`, as: "farmer" },
      { name: "hatchery-table", url: "/hatchery/reservations", as: "hatchery" },
      { name: "safety", url: "/safety" },
    ]);
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
