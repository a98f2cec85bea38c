// A lock between concurrent runs on one clone (e.g. two `npm test` runs and one build folder), held
// with `proper-lockfile`: a lock folder whose time the holder refreshes, so the lock of a run that died
// is taken over once it has gone stale.
import { createRequire } from "node:module";
import { log } from "./log.mjs";

/** A lock not refreshed for this long belongs to a run that died (the holder refreshes it every 10 s). */
const STALE_MS = 30_000;

/**
 * Takes the lock of `path` (the folder `path + ".lock"`; `path` itself need not exist) if no live run
 * holds it. Returns its release function, or null when another run holds it.
 */
export function tryLock(path) {
  // Loaded on use: the entry scripts import this module before `npm ci` has installed the package.
  const lockfile = createRequire(import.meta.url)("proper-lockfile");
  try {
    return lockfile.lockSync(path, {
      realpath: false,
      stale: STALE_MS,
      update: STALE_MS / 3,
      // Someone removed the lock folder under a running run: say so rather than crash the run.
      onCompromised: (error) => log("lock", `the lock of ${path} was lost: ${error.message}`),
    });
  } catch (error) {
    if (error.code === "ELOCKED") return null;
    throw error;
  }
}
