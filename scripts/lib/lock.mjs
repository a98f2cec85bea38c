// A folder lock between concurrent runs on one clone (e.g. two `npm test` runs and one build folder).
import { mkdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { join } from "node:path";

function isAlive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

/**
 * Takes the lock at `path` if nobody alive holds it (a lock left by a dead process is taken over).
 * Returns its release function, or null when another live process holds it.
 */
export function tryLock(path) {
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      mkdirSync(path);
      writeFileSync(join(path, "pid"), String(process.pid));
      return () => rmSync(path, { recursive: true, force: true });
    } catch (error) {
      if (error.code !== "EEXIST") throw error;
    }
    let holder = NaN;
    try {
      holder = Number(readFileSync(join(path, "pid"), "utf8"));
    } catch {
      return null; // just made by another run that has not written its pid yet
    }
    if (isAlive(holder)) return null;
    rmSync(path, { recursive: true, force: true });
  }
  return null;
}
