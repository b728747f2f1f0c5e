// The production shape `npm start` runs, for the tests that need a real server process: the compiled
// server (build/, made by scripts/build-server.mjs before the tests) under plain node, with only
// what a deployment has in its environment. It runs in a process group of its own, so a test can
// signal the primary and every worker at once.
import { spawn, type ChildProcess } from "node:child_process";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { createServer } from "node:net";
import path from "node:path";
import { inject } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");
const entry = path.join(root, "build/server/index.js");

export const freePort = () =>
  new Promise<number>((resolve) => {
    const s = createServer().listen(0, "127.0.0.1", () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });

export interface CompiledServer {
  child: ChildProcess;
  base: string;
  port: number;
  /** what the server printed so far */
  output(): string;
  /** the pids of its worker processes (Linux /proc) */
  workers(): number[];
  /** SIGKILL to the primary and every worker at once */
  killAll(): void;
  /** resolves with the primary's exit code (or signal) */
  exited(): Promise<number | string | null>;
}

/** Starts build/server/index.js on `port` (or a free one) and waits until /api/health answers. */
export async function startCompiledServer(env: Record<string, string> = {}, port?: number): Promise<CompiledServer> {
  if (!existsSync(entry)) throw new Error("build/server/index.js is missing: run `npm run build` (npm test does).");
  const p = port ?? (await freePort());
  const base = `http://127.0.0.1:${p}`;
  let output = "";
  const child = spawn(process.execPath, [entry], {
    cwd: root,
    env: { PATH: process.env.PATH, NODE_ENV: "production", PORT: String(p), DATABASE_URL: process.env.DATABASE_URL, SMTP_PORT: String(inject("smtpPort")), LOG_LEVEL: "warn", ...env },
    stdio: ["ignore", "pipe", "pipe"],
    detached: true,
  });
  child.stdout!.on("data", (d) => (output += d));
  child.stderr!.on("data", (d) => (output += d));
  const server: CompiledServer = {
    child,
    base,
    port: p,
    output: () => output,
    workers: () =>
      readdirSync("/proc")
        .filter((d) => /^\d+$/.test(d))
        .filter((d) => {
          try {
            return Number(readFileSync(`/proc/${d}/stat`, "utf8").split(") ")[1].split(" ")[1]) === child.pid;
          } catch {
            return false;
          }
        })
        .map(Number),
    killAll: () => {
      try {
        process.kill(-child.pid!, "SIGKILL");
      } catch {
        // the group is already gone
      }
    },
    exited: () => new Promise((resolve) => (child.exitCode !== null || child.signalCode ? resolve(child.exitCode ?? child.signalCode) : child.once("exit", (code, signal) => resolve(code ?? signal)))),
  };
  for (let i = 0; i < 150; i++) {
    if (child.exitCode !== null) throw new Error(`the compiled server exited with ${child.exitCode}:\n${output}`);
    if (await fetch(`${base}/api/health`).then((r) => r.ok, () => false)) return server;
    await new Promise((r) => setTimeout(r, 100));
  }
  server.killAll();
  throw new Error(`the compiled server did not answer:\n${output}`);
}

/** True while any process of the server's group is alive. */
export function groupAlive(server: CompiledServer): boolean {
  try {
    process.kill(-server.child.pid!, 0);
    return true;
  } catch {
    return false;
  }
}
