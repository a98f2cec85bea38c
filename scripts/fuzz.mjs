#!/usr/bin/env node
// `npm run fuzz`: the property tests (every test file that uses fast-check) with fresh random seeds,
// where `npm test` always runs them with one fixed seed. Each round prints its seed first; a failing
// round prints how to replay it, so the counterexample can be added as a named regression case.
//
//   npm run fuzz                          one round with a random seed
//   npm run fuzz -- --rounds 5            five rounds, a new seed each
//   npm run fuzz -- --seed 1845155118     replay one seed
import { randomInt } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import { join, relative, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { run } from "./lib/processes.mjs";

const repoRoot = resolve(fileURLToPath(import.meta.url), "../..");

function option(name) {
  const at = process.argv.indexOf(name);
  if (at < 0) return undefined;
  const value = Number(process.argv[at + 1]);
  if (!Number.isSafeInteger(value)) throw new Error(`${name} takes an integer, got ${process.argv[at + 1]}`);
  return value;
}

/** Test files under `folder` that import fast-check, as paths from the repository root. */
function propertyTestFiles(folder) {
  return readdirSync(join(repoRoot, folder), { recursive: true })
    .filter((name) => name.endsWith(".test.ts"))
    .map((name) => join(repoRoot, folder, name))
    .filter((path) => /from "fast-check"/.test(readFileSync(path, "utf8")))
    .map((path) => relative(repoRoot, path));
}

const fixedSeed = option("--seed");
const rounds = fixedSeed === undefined ? (option("--rounds") ?? 1) : 1;
const files = [...propertyTestFiles("tests/unit"), ...propertyTestFiles("tests/integration")];
console.log(`[fuzz] ${files.length} property test files:\n  ${files.join("\n  ")}`);

const failedSeeds = [];
for (let round = 1; round <= rounds; round++) {
  const seed = fixedSeed ?? randomInt(1, 2 ** 31);
  console.log(`[fuzz] round ${round} of ${rounds}: ARCWRIGHT_FUZZ_SEED=${seed}`);
  const code = await run(process.execPath, ["scripts/test.mjs", "--phase", "unit,integration", ...files], {
    cwd: repoRoot,
    env: { ...process.env, ARCWRIGHT_FUZZ_SEED: String(seed) },
  });
  if (code !== 0) failedSeeds.push(seed);
}
for (const seed of failedSeeds) {
  console.log(`[fuzz] failed with seed ${seed}. Replay: npm run fuzz -- --seed ${seed}`);
  console.log("[fuzz] fast-check prints the counterexample above; add it as a named regression case beside the property.");
}
console.log(`[fuzz] ${rounds - failedSeeds.length} of ${rounds} rounds passed`);
process.exit(failedSeeds.length === 0 ? 0 : 1);
