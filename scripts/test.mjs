#!/usr/bin/env node
// `npm test`: self-contained on a fresh clone. Installs what is missing, runs a throwaway PostgreSQL
// on a free loopback port, type-checks, runs the unit and integration tests, builds and serves the
// app, runs the end-to-end tests in Debian's Chromium, and tears everything down whatever happens.
//
//   npm test                                  every phase
//   npm test -- --phase unit,integration      only some phases (typecheck, unit, integration, e2e)
//   npm test -- tests/unit/env.test.ts        extra arguments are vitest file filters
import { chmodSync, existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { appEnvironment } from "./lib/app-env.mjs";
import { ensureBuild } from "./lib/build.mjs";
import { ensureDebianPackages } from "./lib/debian.mjs";
import { ensureNodeModules } from "./lib/deps.mjs";
import { startFakes } from "./lib/fakes.mjs";
import { log } from "./lib/log.mjs";
import { tryLock } from "./lib/lock.mjs";
import { freePort, waitForHttp } from "./lib/ports.mjs";
import { Cluster } from "./lib/postgres.mjs";
import { run, runOrThrow, startChild, stopAll } from "./lib/processes.mjs";
import { throwawaySecrets } from "./lib/secrets.mjs";

const repoRoot = resolve(fileURLToPath(import.meta.url), "../..");
const bin = (name) => join(repoRoot, "node_modules", ".bin", name);
const allPhases = ["typecheck", "unit", "integration", "e2e"];
/** Integration test files run in this many workers, one database each: one per core of the machines we run on. */
const INTEGRATION_WORKERS = 2;

function parseArgs(argv) {
  const filters = [...argv];
  let phases = allPhases;
  const at = filters.indexOf("--phase");
  if (at >= 0) {
    phases = (filters[at + 1] ?? "").split(",");
    filters.splice(at, 2);
  }
  const unknown = phases.filter((p) => !allPhases.includes(p));
  if (unknown.length > 0) throw new Error(`--phase: unknown phase ${unknown.join(", ")} (known: ${allPhases.join(", ")})`);
  return { phases, filters };
}

let cluster;
const cleanups = [];

async function runCleanups() {
  while (cleanups.length > 0) await cleanups.pop()();
}

const totals = { passed: 0, failed: 0, skipped: 0 };
const failures = [];

/** Runs one vitest project and adds its counts to the totals (from vitest's JSON report). */
async function vitestProject(project, env, tmp, filters) {
  const report = join(tmp, `${project}.json`);
  const code = await run(
    bin("vitest"),
    ["run", "--project", project, "--reporter=default", "--reporter=json", `--outputFile.json=${report}`, "--passWithNoTests", ...filters],
    { cwd: repoRoot, env },
  );
  if (existsSync(report)) {
    const result = JSON.parse(readFileSync(report, "utf8"));
    totals.passed += result.numPassedTests;
    totals.failed += result.numFailedTests;
    totals.skipped += result.numPendingTests + result.numTodoTests;
    if (result.numFailedTestSuites > 0 && result.numFailedTests === 0) totals.failed += result.numFailedTestSuites;
  } else if (code !== 0) {
    totals.failed += 1;
  }
  if (code !== 0) failures.push(`vitest ${project} (exit ${code})`);
}

/** Type-checks the whole project (app, tests, scripts); resolves with whether it passed, counted in the totals. */
async function typecheckRun(env) {
  log("test", "type check (tsc --noEmit), beside the unit tests");
  const code = await run(bin("tsc"), ["--noEmit", "-p", "."], { cwd: repoRoot, env });
  if (code === 0) {
    totals.passed += 1;
    log("test", "type check passed");
    return true;
  }
  totals.failed += 1;
  failures.push("typecheck");
  return false;
}

async function main() {
  const { phases, filters } = parseArgs(process.argv.slice(2));
  const startedAt = Date.now();
  ensureNodeModules(repoRoot);
  // The outside validators of the exports (tests/validators/): astropy and STILTS read the tables back;
  // pdflatex compiles the LaTeX export with Latin Modern fonts; qpdf, pdffonts and pdftotext check the
  // PDFs, pngcheck the PNGs, and Python's icalendar parses the calendars.
  const validators =
    phases.includes("unit") || phases.includes("integration")
      ? ["python3-astropy", "stilts", "texlive-latex-base", "lmodern", "poppler-utils", "qpdf", "pngcheck", "python3-icalendar"]
      : [];
  ensureDebianPackages(["postgresql", ...validators, ...(phases.includes("e2e") ? ["chromium"] : [])]);

  const tmp = mkdtempSync(join(tmpdir(), "arcwright-test-"));
  chmodSync(tmp, 0o755); // the server's own user must reach its folder inside
  const secrets = throwawaySecrets();
  cluster = new Cluster({ root: join(tmp, "postgres"), port: await freePort(), password: secrets.postgresPassword, throwaway: true });
  try {
    cluster.initialize();
    cluster.start();
    cluster.ensureDatabase("arcwright_test");
    const appPort = await freePort();
    const appUrl = `http://127.0.0.1:${appPort}`;
    const baseEnv = appEnvironment({ databaseUrl: cluster.url("arcwright_test"), appUrl, secrets, nodeEnv: "test" });
    await runOrThrow("migrations", bin("tsx"), ["scripts/migrate.ts"], { cwd: repoRoot, env: baseEnv });
    if (phases.includes("integration")) {
      // Each integration worker gets its own copy of the migrated database (tests/support/worker-database.ts),
      // made while nothing else is connected to it.
      for (let worker = 1; worker <= INTEGRATION_WORKERS; worker++) cluster.copyDatabase("arcwright_test", `arcwright_test_w${worker}`);
    }

    // tsc checks on one thread, so it runs beside the unit tests, which have the other core.
    const typecheck = phases.includes("typecheck") ? typecheckRun(baseEnv) : Promise.resolve(false);
    if (phases.includes("unit")) await vitestProject("unit", baseEnv, tmp, filters);
    const typesChecked = await typecheck;

    // The app's build and the demo seed for the browser tests start now and run beside the integration
    // tests, which wait on their database and sockets much of the time.
    let e2e = null;
    if (phases.includes("e2e")) {
      // The shared build folder is reused while the sources are unchanged; a run that finds it in use
      // by another run builds into a folder of its own and removes it afterwards.
      const release = tryLock(join(repoRoot, ".next-test"));
      const distDir = release ? ".next-test" : `.next-test-${process.pid}`;
      cleanups.push(release ?? (() => rmSync(join(repoRoot, distDir), { recursive: true, force: true })));
      const fakes = await startFakes({ stateDir: join(tmp, "fakes"), appUrl });
      cleanups.push(fakes.stop);
      // A build after this run's own passing tsc (which covers the app, its tests and scripts) does not
      // type-check again (next.config.mjs).
      const env = { ...baseEnv, ...fakes.env, NODE_ENV: "production", ARCWRIGHT_DIST_DIR: distDir, ...(typesChecked ? { ARCWRIGHT_TYPES_CHECKED: "1" } : {}) };
      // The demo seed goes into the database the integration tests leave alone (they use their copies).
      const ready = Promise.all([ensureBuild(repoRoot, distDir, env), runOrThrow("demo seed", bin("tsx"), ["scripts/seed.ts"], { cwd: repoRoot, env })]);
      ready.catch(() => {}); // awaited below; a failure must not end the run before the integration tests report
      e2e = { env, ready };
    }

    if (phases.includes("integration")) {
      const env = { ...baseEnv, ARCWRIGHT_WORKER_DATABASES: String(INTEGRATION_WORKERS) };
      await vitestProject("integration", env, tmp, [`--maxWorkers=${INTEGRATION_WORKERS}`, ...filters]);
    }

    if (e2e !== null) {
      const { env } = e2e;
      await e2e.ready;
      // Served as `npm start` serves it: one `next start` per core (scripts/serve.mjs).
      startChild("app", process.execPath, ["scripts/serve.mjs", "-H", "127.0.0.1", "-p", String(appPort)], { cwd: repoRoot, env });
      await waitForHttp(`${appUrl}/api/health`, { timeoutMs: 90_000 });
      await vitestProject("e2e", { ...env, E2E_BASE_URL: appUrl }, tmp, filters);
    }
  } finally {
    await stopAll();
    await runCleanups();
    cluster.stop();
    rmSync(tmp, { recursive: true, force: true });
  }
  const seconds = ((Date.now() - startedAt) / 1000).toFixed(0);
  log("test", `finished in ${seconds} s${failures.length ? `; failed: ${failures.join(", ")}` : ""}`);
  // The plain closing line CI reads.
  console.log(`tests: ${totals.passed} passed, ${totals.failed} failed, ${totals.skipped} skipped`);
  return failures.length === 0 && totals.failed === 0 ? 0 : 1;
}

let exitCode = 1;
for (const signal of ["SIGINT", "SIGTERM"]) {
  process.on(signal, async () => {
    await stopAll();
    await runCleanups();
    cluster?.stop();
    process.exit(130);
  });
}
try {
  exitCode = await main();
} catch (error) {
  console.error(`[test] ${error.message}`);
  console.log(`tests: ${totals.passed} passed, ${totals.failed + 1} failed, ${totals.skipped} skipped`);
  exitCode = 1;
}
process.exit(exitCode);
