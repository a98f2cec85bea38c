// The production build that `npm test` and the load run serve, made only when the sources changed.
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { isBuildCurrent, markBuild, sourceDigest } from "./build-stamp.mjs";
import { log } from "./log.mjs";
import { runOrThrow } from "./processes.mjs";

/**
 * Builds into `distDir` (env.ARCWRIGHT_DIST_DIR) unless its build came from these very sources.
 * `next build` adds its build folder's types to tsconfig.json; a throwaway folder must not stay there,
 * so the file is put back as it was.
 */
export async function ensureBuild(repoRoot, distDir, env) {
  const digest = sourceDigest(repoRoot);
  if (isBuildCurrent(join(repoRoot, distDir), digest)) {
    log("build", `${distDir} is current; not rebuilding`);
    return;
  }
  const tsconfigPath = join(repoRoot, "tsconfig.json");
  const tsconfig = readFileSync(tsconfigPath, "utf8");
  try {
    await runOrThrow("next build", join(repoRoot, "node_modules", ".bin", "next"), ["build"], { cwd: repoRoot, env });
  } finally {
    if (readFileSync(tsconfigPath, "utf8") !== tsconfig) writeFileSync(tsconfigPath, tsconfig);
  }
  markBuild(join(repoRoot, distDir), digest);
}
