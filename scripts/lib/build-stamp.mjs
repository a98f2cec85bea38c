// Whether the production build in a folder was made from the sources as they are now.
import { createHash } from "node:crypto";
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync } from "node:fs";
import { join, relative } from "node:path";

const sourceRoots = ["app", "components", "lib", "workers", "db", "public"];
const sourceFiles = ["package-lock.json", "next.config.mjs", "proxy.ts", "tailwind.config.ts", "postcss.config.mjs", "tsconfig.json"];

function walk(dir, out) {
  if (!existsSync(dir)) return;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) walk(path, out);
    else out.push(path);
  }
}

/** A digest of every file the build reads (path, size and contents). */
export function sourceDigest(repoRoot) {
  const files = [];
  for (const root of sourceRoots) walk(join(repoRoot, root), files);
  for (const file of sourceFiles) if (existsSync(join(repoRoot, file))) files.push(join(repoRoot, file));
  const hash = createHash("sha256");
  for (const file of files.sort()) {
    hash.update(relative(repoRoot, file)).update("\0").update(String(statSync(file).size)).update("\0");
    hash.update(readFileSync(file));
  }
  return hash.digest("hex");
}

export function isBuildCurrent(distDir, digest) {
  const stamp = join(distDir, "arcwright-source-sha256");
  return existsSync(join(distDir, "BUILD_ID")) && existsSync(stamp) && readFileSync(stamp, "utf8").trim() === digest;
}

export function markBuild(distDir, digest) {
  writeFileSync(join(distDir, "arcwright-source-sha256"), `${digest}\n`);
}
