#!/usr/bin/env node
// `npm run bench:load`: the load run, self-contained on a fresh clone. Starts a throwaway PostgreSQL
// cluster, migrates it, builds the app into .next-load/ (reused while the sources are unchanged),
// seeds one proposal with 1,000 targets and a team of five, serves it with scripts/serve.mjs (one
// `next start` per core), signs every member in, drives it with autocannon (target-list reads,
// target edits, note writes) and prints throughput and latency per request kind. Everything it
// started is stopped however it ends.
//
//   npm run bench:load                         100 clients, each sending 1 request/s, for 60 s
//   npm run bench:load -- --rate 2             each client sends 2 requests/s
//   npm run bench:load -- --closed-loop        each client sends its next request as soon as the
//                                              last is answered: the app's saturation throughput
//   npm run bench:load -- --duration 10 --connections 20 --warmup 3   a quick run
//
// The measured run follows a warm-up (default 10 s) of the same load whose answers are not counted:
// every `next start` process compiles each route on first use, and the first requests would measure that.
//
// Exits 0 when every request answered 2xx (timing targets are printed as met/missed, never fail it),
// 1 when a request errored or answered otherwise, or when the run itself broke.
import { chmodSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { appEnvironment } from "../lib/app-env.mjs";
import { ensureBuild } from "../lib/build.mjs";
import { ensureDebianPackages } from "../lib/debian.mjs";
import { ensureNodeModules } from "../lib/deps.mjs";
import { startFakes } from "../lib/fakes.mjs";
import { tryLock } from "../lib/lock.mjs";
import { log } from "../lib/log.mjs";
import { freePort, waitForHttp } from "../lib/ports.mjs";
import { Cluster } from "../lib/postgres.mjs";
import { runOrThrow, startChild, stopAll } from "../lib/processes.mjs";
import { throwawaySecrets } from "../lib/secrets.mjs";
import { postgresPid, startCpuCount } from "./cpu-time.mjs";
import { preflight, requestKinds, runMix } from "./mix.mjs";
import { machineLine, printReport, Recorder } from "./report.mjs";
import { signIn } from "../lib/sign-in.mjs";
import { webProcessCount } from "../lib/web-processes.mjs";

const repoRoot = resolve(fileURLToPath(import.meta.url), "../../..");
const bin = (name) => join(repoRoot, "node_modules", ".bin", name);

function parseArgs(argv) {
  const options = { durationSeconds: 60, connections: 100, requestsPerSecondPerConnection: 1, warmupSeconds: 10 };
  const flags = { "--duration": "durationSeconds", "--connections": "connections", "--rate": "requestsPerSecondPerConnection", "--warmup": "warmupSeconds" };
  const known = "known: --duration <s>, --connections <n>, --rate <requests/s per client>, --closed-loop, --warmup <s>";
  for (let i = 0; i < argv.length; i += 2) {
    if (argv[i] === "--closed-loop") {
      options.requestsPerSecondPerConnection = undefined;
      i -= 1;
      continue;
    }
    const key = flags[argv[i]];
    const value = Number(argv[i + 1]);
    if (!key) throw new Error(`unknown argument ${argv[i]} (${known})`);
    const least = key === "warmupSeconds" ? 0 : 1;
    if (!Number.isInteger(value) || value < least) throw new Error(`${argv[i]} needs a whole number of at least ${least}, got ${argv[i + 1]}`);
    options[key] = value;
  }
  return options;
}

let cluster;
let tmp;
let stopLoad;
const cleanups = [];
let tornDown;

/** Stops the load, the app, the fakes and PostgreSQL, then removes the run's folder; runs once. */
function tearDown() {
  tornDown ??= (async () => {
    stopLoad?.();
    await stopAll();
    while (cleanups.length > 0) await cleanups.pop()();
    cluster?.stop();
    if (tmp) rmSync(tmp, { recursive: true, force: true });
  })();
  return tornDown;
}

async function main() {
  const { durationSeconds, connections, requestsPerSecondPerConnection, warmupSeconds } = parseArgs(process.argv.slice(2));
  ensureNodeModules(repoRoot);
  ensureDebianPackages(["postgresql"]);

  tmp = mkdtempSync(join(tmpdir(), "arcwright-load-"));
  chmodSync(tmp, 0o755); // the server's own user must reach its folder inside
  const secrets = throwawaySecrets();
  // Not `throwaway`: the data goes when the run ends, but writes should cost what they cost in
  // production (fsync on), or the write figures would flatter the app.
  cluster = new Cluster({ root: join(tmp, "postgres"), port: await freePort(), password: secrets.postgresPassword });
  cluster.initialize();
  cluster.start();
  cluster.ensureDatabase("arcwright_load");

  // The build folder is shared by load runs while the sources are unchanged; a run that finds it in
  // use by another builds into a folder of its own and removes it afterwards.
  const release = tryLock(join(repoRoot, ".next-load"));
  const distDir = release ? ".next-load" : `.next-load-${process.pid}`;
  cleanups.push(release ?? (() => rmSync(join(repoRoot, distDir), { recursive: true, force: true })));

  const appPort = await freePort();
  const appUrl = `http://127.0.0.1:${appPort}`;
  const fakes = await startFakes({ stateDir: join(tmp, "fakes"), appUrl });
  cleanups.push(fakes.stop);
  const env = appEnvironment({
    databaseUrl: cluster.url("arcwright_load"),
    appUrl,
    secrets,
    nodeEnv: "production",
    extra: { ...fakes.env, ARCWRIGHT_DIST_DIR: distDir },
  });
  await runOrThrow("migrations", bin("tsx"), ["scripts/migrate.ts"], { cwd: repoRoot, env });
  await ensureBuild(repoRoot, distDir, env);
  const seedFile = join(tmp, "load-seed.json");
  await runOrThrow("load seed", bin("tsx"), ["scripts/load/seed-load.ts", "--out", seedFile], { cwd: repoRoot, env });
  const seed = JSON.parse(readFileSync(seedFile, "utf8"));

  const appProcesses = webProcessCount(env);
  let isRunning = true;
  const server = startChild("app", process.execPath, ["scripts/serve.mjs", "-H", "127.0.0.1", "-p", String(appPort)], { cwd: repoRoot, env });
  const serverExit = new Promise((_, reject) => {
    server.once("exit", (code) => isRunning && reject(new Error(`the app (scripts/serve.mjs) exited (${code}) during the load run`)));
  });
  serverExit.catch(() => {});
  await Promise.race([waitForHttp(`${appUrl}/api/health`, { timeoutMs: 90_000 }), serverExit]);

  const members = [];
  for (const member of seed.members) members.push({ ...member, cookie: await signIn(appUrl, member) });
  log("load", `signed in ${members.length} members (${members.map((m) => m.role).join(", ")})`);
  const kinds = requestKinds(seed);
  await preflight(appUrl, kinds, members);

  let warmupFailures = 0;
  const mix = { appUrl, kinds, members, totalConnections: connections, requestsPerSecondPerConnection, onStart: (stop) => (stopLoad = stop) };
  if (warmupSeconds > 0) {
    log("load", `warm-up: ${warmupSeconds} s of the same load, not counted`);
    const warmup = new Recorder(kinds.map((kind) => kind.name));
    await Promise.race([runMix({ ...mix, durationSeconds: warmupSeconds, recorder: warmup }), serverExit]);
    warmupFailures = warmup.failures();
    if (warmupFailures > 0) log("load", `warm-up: ${warmupFailures} requests errored or answered non-2xx (they fail the run too)`);
  }
  const recorder = new Recorder(kinds.map((kind) => kind.name));
  const machineBefore = machineLine();
  log("load", `${connections} connections for ${durationSeconds} s against ${appUrl}`);
  const cpuSinceStart = startCpuCount({ appPid: server.pid, databasePid: postgresPid(cluster.dataDir) });
  const { elapsedSeconds, instanceCount } = await Promise.race([runMix({ ...mix, durationSeconds, recorder }), serverExit]);
  const cpuMs = cpuSinceStart();
  isRunning = false;
  const pacing = requestsPerSecondPerConnection ? `each paced to ${requestsPerSecondPerConnection} request/s` : "each sending its next request as soon as the last is answered";
  const instancesOf = requestsPerSecondPerConnection ? "one per connection" : "one per kind and member";
  const settings = `${connections} connections ${pacing} (${instanceCount} autocannon instances, ${instancesOf}), ${appProcesses} app processes, DATABASE_POOL_MAX=${env.DATABASE_POOL_MAX ?? "unset (lib/env.ts default)"} each`;
  const failed = printReport({
    kinds,
    recorder,
    elapsedSeconds,
    connections,
    isPaced: requestsPerSecondPerConnection !== undefined,
    cpuMs,
    appProcesses,
    settings,
    machineBefore,
  });
  return failed + warmupFailures === 0 ? 0 : 1;
}

let exitCode = 1;
for (const signal of ["SIGINT", "SIGTERM"]) {
  process.on(signal, async () => {
    await tearDown();
    process.exit(130);
  });
}
try {
  exitCode = await main();
} catch (error) {
  console.error(`[load] ${error.message}`);
  exitCode = 1;
} finally {
  await tearDown();
}
process.exit(exitCode);
