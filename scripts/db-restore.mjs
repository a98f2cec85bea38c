#!/usr/bin/env node
// `npm run db:restore FILE [-- --into NAME]`: restores a dump from `npm run db:backup` into an EMPTY
// database (DATABASE_URL, or the local cluster's `arcwright`, or a new database NAME of the local
// cluster). It refuses a database that holds tables, so a restore never mixes with or overwrites data,
// and it runs in one transaction: a failed restore leaves the database as empty as it was.
import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { log } from "./lib/log.mjs";
import { postgresBinDir } from "./lib/postgres.mjs";
import { openTargetDatabase } from "./lib/target-database.mjs";

const repoRoot = resolve(fileURLToPath(import.meta.url), "../..");
const args = process.argv.slice(2);
const intoAt = args.indexOf("--into");
const into = intoAt >= 0 ? args.splice(intoAt, 2)[1] : undefined;
const file = args[0];

function fail(message) {
  console.error(`[restore] ${message}`);
  process.exit(1);
}

if (!file) fail("usage: npm run db:restore FILE [-- --into NAME]");
if (!existsSync(file)) fail(`no such backup file: ${file}`);
if (into !== undefined && !/^[a-z_][a-z0-9_]{0,62}$/.test(into)) fail(`--into: '${into}' is not a plain database name (a-z, 0-9, _)`);

const target = openTargetDatabase(repoRoot, into ? { database: into } : {});
try {
  if (into) {
    if (!target.cluster) throw new Error("--into works with the local cluster; with DATABASE_URL, point it at an empty database instead");
    target.cluster.ensureDatabase(into);
  }
  const bin = postgresBinDir();
  const tables = spawnSync(
    join(bin, "psql"),
    ["--no-psqlrc", "-tAc", "select count(*) from pg_tables where schemaname not in ('pg_catalog', 'information_schema')", target.url],
    { encoding: "utf8" },
  );
  if (tables.status !== 0) throw new Error(`cannot reach the target database: ${tables.stderr.trim()}`);
  if (Number(tables.stdout.trim()) > 0) {
    throw new Error(`the target database is not empty (${tables.stdout.trim()} tables); restore into an empty one (e.g. --into arcwright_restored)`);
  }
  const result = spawnSync(join(bin, "pg_restore"), ["--single-transaction", "--exit-on-error", "--no-owner", `--dbname=${target.url}`, resolve(file)], {
    stdio: ["ignore", "inherit", "inherit"],
  });
  if (result.status !== 0) throw new Error(`pg_restore failed (exit ${result.status}); nothing was restored`);
  log("restore", `restored ${file}`);
} catch (error) {
  console.error(`[restore] ${error.message}`);
  process.exitCode = 1;
} finally {
  target.done();
}
