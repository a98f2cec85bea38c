#!/usr/bin/env node
// `npm start` (production build) and `npm run dev` (next dev): everything from a fresh clone to a
// running Arcwright with demo data. State lives in .data/ (git-ignored) and survives restarts.
import { createHash } from "node:crypto";
import { join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { appEnvironment } from "./lib/app-env.mjs";
import { isBuildCurrent, markBuild, sourceDigest } from "./lib/build-stamp.mjs";
import { ensureNodeModules } from "./lib/deps.mjs";
import { startFakes } from "./lib/fakes.mjs";
import { log } from "./lib/log.mjs";
import { waitForHttp } from "./lib/ports.mjs";
import { Cluster, serverUserCanReach } from "./lib/postgres.mjs";
import { runCapturing, runOrThrow, startChild, stopAll } from "./lib/processes.mjs";
import { loadOrCreateSecrets } from "./lib/secrets.mjs";

const repoRoot = resolve(fileURLToPath(import.meta.url), "../..");
const isDev = process.argv.includes("--dev");
const stateDir = join(repoRoot, ".data");
const appPort = Number(process.env.PORT ?? process.env.ARCWRIGHT_PORT ?? 3000);
const dbPort = Number(process.env.ARCWRIGHT_DB_PORT ?? 54329);
const uploadsPort = Number(process.env.ARCWRIGHT_UPLOADS_PORT ?? 54331);
const appUrl = `http://127.0.0.1:${appPort}`;
const bin = (name) => join(repoRoot, "node_modules", ".bin", name);

let cluster;
let fakes;
let stopping = false;

/** .data/postgres, unless the server's user cannot reach the clone (then a folder of its own under /var/lib). */
function clusterRoot() {
  const inClone = join(stateDir, "postgres");
  if (serverUserCanReach(stateDir)) return inClone;
  const digest = createHash("sha256").update(repoRoot).digest("hex").slice(0, 12);
  const outside = join("/var/lib/arcwright", digest, "postgres");
  log("postgres", `the postgres user cannot reach ${stateDir}; keeping this clone's cluster in ${outside}`);
  return outside;
}

async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  log("stop", "stopping Arcwright");
  await stopAll();
  await fakes?.stop();
  cluster?.stop();
  process.exit(code);
}

process.on("SIGINT", () => shutdown(0));
process.on("SIGTERM", () => shutdown(0));

try {
  const startedAt = Date.now();
  ensureNodeModules(repoRoot);
  const secrets = loadOrCreateSecrets(stateDir);

  let databaseUrl = process.env.DATABASE_URL;
  if (databaseUrl) {
    log("postgres", "using DATABASE_URL from the environment");
  } else {
    cluster = new Cluster({ root: clusterRoot(), port: dbPort, password: secrets.postgresPassword });
    if (cluster.initialize()) log("postgres", `created a new cluster in ${cluster.dataDir}`);
    cluster.start();
    cluster.ensureDatabase("arcwright");
    databaseUrl = cluster.url("arcwright");
  }

  fakes = await startFakes({ stateDir: join(stateDir, "fakes"), appUrl, uploadsPort });
  const env = appEnvironment({
    databaseUrl,
    appUrl,
    secrets,
    nodeEnv: isDev ? "development" : "production",
    extra: fakes.env,
  });
  await runOrThrow("migrations", bin("tsx"), ["scripts/migrate.ts"], { cwd: repoRoot, env });
  const seedOutput = await runCapturing("demo seed", bin("tsx"), ["scripts/seed.ts"], { cwd: repoRoot, env });

  if (isDev) {
    // The same client-address header as scripts/serve.mjs gives `next start` (NODE_OPTIONS reaches the
    // server process next dev starts).
    const hook = pathToFileURL(join(repoRoot, "scripts", "lib", "socket-address.mjs")).href;
    const nodeOptions = [env.NODE_OPTIONS, `--import=${hook}`].filter(Boolean).join(" ");
    startChild("next dev", bin("next"), ["dev", "-H", "127.0.0.1", "-p", String(appPort)], { cwd: repoRoot, env: { ...env, NODE_OPTIONS: nodeOptions } });
  } else {
    const distDir = join(repoRoot, ".next");
    const digest = sourceDigest(repoRoot);
    if (isBuildCurrent(distDir, digest)) {
      log("build", "production build is current; not rebuilding");
    } else {
      await runOrThrow("next build", bin("next"), ["build"], { cwd: repoRoot, env });
      markBuild(distDir, digest);
    }
    // One `next start` per core on the one port (scripts/serve.mjs).
    const server = startChild("app", process.execPath, ["scripts/serve.mjs", "-H", "127.0.0.1", "-p", String(appPort)], {
      cwd: repoRoot,
      env,
    });
    server.on("exit", (code) => {
      if (!stopping) {
        log("app", `the app (scripts/serve.mjs) exited (${code}); stopping`);
        shutdown(code ?? 1);
      }
    });
  }
  await waitForHttp(`${appUrl}/api/health`, { timeoutMs: 120_000 });
  // The accounts again, last, so they are on screen beside the URL after the build output.
  for (const line of seedOutput.split("\n").filter((l) => l.includes("password:") || l.includes("demo accounts"))) {
    process.stdout.write(`${line}\n`);
  }
  log("ready", `Arcwright is at ${appUrl}  (set up in ${((Date.now() - startedAt) / 1000).toFixed(1)} s; Ctrl-C stops everything)`);
} catch (error) {
  console.error(`[start] ${error.message}`);
  await shutdown(1);
}
