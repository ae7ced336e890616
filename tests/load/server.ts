import { spawn, type ChildProcess } from "node:child_process";
import { closeSync, existsSync, openSync, readdirSync, readFileSync } from "node:fs";
import { createServer } from "node:net";

// The production server the load test drives: `next start` on its own port, in a process group of its own
// (detached = setsid), so `kill -9` of the group takes the real node process and anything it started, not just a
// wrapper. Output goes to a log file in the run's temporary folder; the test reads it for unexpected errors.

export async function assertPortFree(port: number): Promise<void> {
  await new Promise<void>((resolve, reject) => {
    const probe = createServer().once("error", () => reject(new Error(`port ${port} is in use: stop the old server first (or set LOAD_PORT)`)));
    probe.listen(port, "127.0.0.1", () => probe.close(() => resolve()));
  });
}

/** Process ids whose process group is `pgid`, read from /proc (Linux): field 5 of /proc/<pid>/stat. */
export function groupMembers(pgid: number): number[] {
  if (!existsSync("/proc")) return [];
  const out: number[] = [];
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, "utf8");
      // The command name (field 2) is in parentheses and may hold spaces: split after its closing one.
      const rest = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
      const state = rest[0];
      if (Number(rest[2]) === pgid && state !== "Z") out.push(Number(entry));
    } catch {
      // the process ended while we looked
    }
  }
  return out;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export class AppServer {
  private child: ChildProcess | null = null;
  private exited: Promise<void> = Promise.resolve();
  startedAt = 0;

  constructor(
    readonly port: number,
    private readonly env: NodeJS.ProcessEnv,
    private readonly logFile: string,
  ) {}

  get base(): string {
    return `http://127.0.0.1:${this.port}`;
  }

  get pid(): number | null {
    return this.child?.pid ?? null;
  }

  /** Starts `next start` and waits until /api/health answers 200; returns the seconds it took. */
  async start(timeoutMs = 90_000): Promise<number> {
    if (this.child) throw new Error("server already started");
    await assertPortFree(this.port);
    const started = Date.now();
    const log = openSync(this.logFile, "a");
    const child = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", String(this.port), "-H", "127.0.0.1"], { env: this.env, stdio: ["ignore", log, log], detached: true });
    closeSync(log);
    this.child = child;
    this.exited = new Promise((resolve) => child.once("exit", () => resolve()));
    let gone = false;
    void this.exited.then(() => {
      gone = true;
    });
    while (Date.now() - started < timeoutMs) {
      if (gone) throw new Error(`the server exited while starting; see ${this.logFile}`);
      try {
        if ((await fetch(`${this.base}/api/health`, { signal: AbortSignal.timeout(5_000) })).ok) {
          this.startedAt = Date.now();
          return (this.startedAt - started) / 1000;
        }
      } catch {
        // not listening yet
      }
      await sleep(250);
    }
    throw new Error(`the server did not answer /api/health within ${timeoutMs / 1000} s; see ${this.logFile}`);
  }

  /**
   * SIGKILL to the whole process group, then waits until no process of the group is left and the port is free.
   * Returns the process ids that were killed (the group as it was).
   */
  async kill9(): Promise<number[]> {
    const child = this.child;
    const pgid = child?.pid;
    if (!child || !pgid) return [];
    const members = groupMembers(pgid);
    try {
      process.kill(-pgid, "SIGKILL");
    } catch {
      // the group is gone already
    }
    await this.exited;
    const end = Date.now() + 10_000;
    while (groupMembers(pgid).length > 0) {
      if (Date.now() > end) throw new Error(`processes of group ${pgid} survived SIGKILL: ${groupMembers(pgid).join(", ")}`);
      await sleep(50);
    }
    this.child = null;
    for (let i = 0; i < 100; i++) {
      try {
        await assertPortFree(this.port);
        break;
      } catch (err) {
        if (i === 99) throw err;
        await sleep(50);
      }
    }
    return members.length > 0 ? members : [pgid];
  }

  /** Ends the server: SIGTERM to the group, SIGKILL if it is still there after 5 s. */
  async stop(): Promise<void> {
    const child = this.child;
    const pgid = child?.pid;
    if (!child || !pgid) return;
    try {
      process.kill(-pgid, "SIGTERM");
    } catch {
      // gone already
    }
    const timedOut = await Promise.race([this.exited.then(() => false), sleep(5_000).then(() => true)]);
    if (timedOut || groupMembers(pgid).length > 0) await this.kill9();
    this.child = null;
  }

  /** Lines of the server's log that report an unexpected error (lib/api/handler.ts logs them as "[api] unexpected error"). */
  unexpectedErrors(): string[] {
    if (!existsSync(this.logFile)) return [];
    return readFileSync(this.logFile, "utf8")
      .split("\n")
      .filter((l) => l.includes("[api] unexpected error") || /\bUnhandled|uncaughtException|FATAL\b/.test(l));
  }
}
