// npm dependencies, installed from the lock file when node_modules is missing or older than the lock.
import { createHash } from "node:crypto";
import { spawnSync } from "node:child_process";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { log } from "./log.mjs";

const stampName = ".arcwright-lock-sha256";

/** Runs `npm ci` unless node_modules was installed from exactly this package-lock.json. */
export function ensureNodeModules(repoRoot) {
  const lock = readFileSync(join(repoRoot, "package-lock.json"));
  const digest = createHash("sha256").update(lock).digest("hex");
  const stamp = join(repoRoot, "node_modules", stampName);
  if (existsSync(stamp) && readFileSync(stamp, "utf8").trim() === digest) return false;
  log("setup", "installing dependencies from package-lock.json (npm ci)");
  const result = spawnSync("npm", ["ci", "--no-audit", "--no-fund"], { cwd: repoRoot, stdio: "inherit" });
  if (result.status !== 0) throw new Error("npm ci failed");
  writeFileSync(stamp, `${digest}\n`);
  return true;
}
