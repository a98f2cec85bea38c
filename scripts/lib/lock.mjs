// A folder lock between concurrent runs on one clone (e.g. two `npm test` runs sharing one build folder).
import { mkdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { log } from "./log.mjs";

function isAlive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

/** Waits (up to `timeoutMs`) until this process holds the lock at `path`; returns its release function. */
export async function acquireLock(path, { timeoutMs = 30 * 60_000 } = {}) {
  const deadline = Date.now() + timeoutMs;
  let announced = false;
  for (;;) {
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
      // The holder has made the folder but not yet written its pid.
    }
    if (Number.isInteger(holder) && !isAlive(holder)) {
      rmSync(path, { recursive: true, force: true });
      continue;
    }
    if (Date.now() > deadline) throw new Error(`${path} is still held by process ${holder} after ${timeoutMs} ms`);
    if (!announced) {
      log("lock", `waiting for process ${holder} to release ${path}`);
      announced = true;
    }
    await new Promise((resolve) => setTimeout(resolve, 1_000));
  }
}
