#!/usr/bin/env node
// `npm run bench`: runs every benchmark in scripts/bench/ (or those named) and prints their figures.
// Benchmarks print numbers and ratios; they never pass or fail on timing.
import { readdirSync } from "node:fs";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { ensureNodeModules } from "./lib/deps.mjs";
import { log } from "./lib/log.mjs";
import { run } from "./lib/processes.mjs";

const repoRoot = resolve(fileURLToPath(import.meta.url), "../..");
ensureNodeModules(repoRoot);
const wanted = process.argv.slice(2);
const benches = readdirSync(join(repoRoot, "scripts", "bench"))
  .filter((file) => file.endsWith(".ts"))
  .filter((file) => wanted.length === 0 || wanted.some((name) => file.includes(name)))
  .sort();

let failed = 0;
for (const file of benches) {
  log("bench", file);
  const code = await run(join(repoRoot, "node_modules", ".bin", "tsx"), [join("scripts", "bench", file)], { cwd: repoRoot });
  if (code !== 0) failed += 1;
}
process.exit(failed === 0 ? 0 : 1);
