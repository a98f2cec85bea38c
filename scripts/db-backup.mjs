#!/usr/bin/env node
// `npm run db:backup [-- --out FILE]`: a consistent dump (pg_dump takes one snapshot for the whole dump)
// in PostgreSQL's custom format, restorable with `npm run db:restore FILE`.
import { spawnSync } from "node:child_process";
import { mkdirSync, renameSync, statSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { log } from "./lib/log.mjs";
import { postgresBinDir } from "./lib/postgres.mjs";
import { openTargetDatabase } from "./lib/target-database.mjs";

const repoRoot = resolve(fileURLToPath(import.meta.url), "../..");
const outAt = process.argv.indexOf("--out");
const stamp = new Date().toISOString().replace(/[-:]/g, "").replace(/\..+/, "").replace("T", "-");
const outFile = resolve(outAt >= 0 ? process.argv[outAt + 1] : join(repoRoot, "backups", `arcwright-${stamp}.dump`));

const target = openTargetDatabase(repoRoot);
try {
  mkdirSync(dirname(outFile), { recursive: true });
  // Written beside the destination and renamed at the end, so a failed dump never looks like a backup.
  const partial = `${outFile}.partial`;
  const result = spawnSync(join(postgresBinDir(), "pg_dump"), ["--format=custom", "--no-owner", `--file=${partial}`, `--dbname=${target.url}`], {
    stdio: ["ignore", "inherit", "inherit"],
  });
  if (result.status !== 0) throw new Error(`pg_dump failed (exit ${result.status})`);
  renameSync(partial, outFile);
  log("backup", `wrote ${outFile} (${(statSync(outFile).size / 1024).toFixed(0)} KiB)`);
} catch (error) {
  console.error(`[backup] ${error.message}`);
  process.exitCode = 1;
} finally {
  target.done();
}
