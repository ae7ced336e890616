// One "app instance" for tests/integration/rate-limit.test.ts: a separate Node process with its own database
// connection, counting attempts against the same SQLite file. Run with --conditions=react-server so that
// `server-only` resolves to its empty module, as it does inside Next's server bundle. It says "ready" once its
// modules are loaded and fires all its attempts together when the test writes "go", so the instances overlap.
// Prints the decisions as one JSON line.
import { once } from "node:events";
import { consumeRateLimit } from "@/lib/api/rate-limit";

const attempts = Number(process.argv[2] ?? "0");
const max = Number(process.argv[3] ?? "0");
const now = Number(process.argv[4] ?? String(Date.now()));
const rule = { name: "test:instances", max, windowSeconds: 600, what: "test attempts" };

console.log("ready");
await once(process.stdin, "data");
const decisions = await Promise.all(Array.from({ length: attempts }, () => consumeRateLimit(rule, "shared-account", { now })));
console.log(JSON.stringify(decisions.map((d) => ({ allowed: d.allowed, count: d.count }))));
process.exit(0);
