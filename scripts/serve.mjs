#!/usr/bin/env node
// Serves the built app from several `next start` processes sharing one port (node:cluster): one Node
// process runs JavaScript on one core, and under load a single process was the bottleneck while the
// machine's other core sat half idle. The processes share nothing but the database (sessions, rate
// limits and invitations all live there), which the two-instance tests check.
//
//   node scripts/serve.mjs -H 127.0.0.1 -p 3000     arguments go to every `next start`
//
// ARCWRIGHT_WEB_PROCESSES sets how many (default: the cores Node may use). A process that dies after
// it was serving is replaced; one that dies before it listened (a broken build, a bad environment)
// stops them all, rather than restarting in a loop. SIGTERM or SIGINT stops them all and exits once
// they have. When this process itself is killed, each `next start` exits on losing its link to it
// (node:cluster's rule for an orphaned worker).
import cluster from "node:cluster";
import { join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { webProcessCount } from "./lib/web-processes.mjs";

const repoRoot = resolve(fileURLToPath(import.meta.url), "../..");

const count = webProcessCount();
// Each process preloads scripts/lib/socket-address.mjs, which gives the app the client's socket address
// (rate limits are keyed on it) in a header no client can set.
const socketAddressHook = pathToFileURL(join(repoRoot, "scripts", "lib", "socket-address.mjs")).href;
cluster.setupPrimary({
  exec: join(repoRoot, "node_modules", "next", "dist", "bin", "next"),
  args: ["start", ...process.argv.slice(2)],
  execArgv: [...process.execArgv, "--import", socketAddressHook],
});
const listened = new Set();
cluster.on("listening", (worker) => listened.add(worker.id));
for (let i = 0; i < count; i++) cluster.fork();

let isStopping = false;
let exitCode = 0;
cluster.on("exit", (worker, code, signal) => {
  if (isStopping) {
    if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(exitCode);
    return;
  }
  const what = `next start (pid ${worker.process.pid}) exited (${signal ?? code})`;
  const hadListened = listened.delete(worker.id);
  if (!hadListened) {
    console.error(`[serve] ${what} before it listened; stopping`);
    stop(1);
    return;
  }
  console.error(`[serve] ${what}; starting another`);
  cluster.fork();
});

/** Asks every process to finish (next start exits on SIGTERM), then exits with `code`. */
function stop(code) {
  isStopping = true;
  exitCode = code;
  const workers = Object.values(cluster.workers ?? {});
  if (workers.length === 0) process.exit(code);
  for (const worker of workers) worker?.process.kill("SIGTERM");
}

for (const signal of ["SIGINT", "SIGTERM"]) process.on(signal, () => stop(0));
