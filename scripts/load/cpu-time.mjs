// CPU time spent by the processes of a run, read from Linux's /proc. On a machine shared with other
// work, latency says how busy the machine was; CPU time per request says what a request costs.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { childPids, processStat } from "../lib/proc.mjs";

/** CPU ms of a process and of its direct children (a PostgreSQL server and its backends; the app's `next start` processes). */
function cpuMsWithChildren(pid) {
  return [pid, ...childPids(pid)].reduce((total, each) => total + (processStat(each)?.cpuMs ?? 0), 0);
}

/** The server's pid from its data folder (first line of postmaster.pid). */
export const postgresPid = (dataDir) => Number(readFileSync(join(dataDir, "postmaster.pid"), "utf8").split("\n")[0]);

/**
 * Starts counting the CPU time of the app, PostgreSQL and this process (the load generator); the
 * returned function gives each one's ms since then, or null where /proc is not available.
 */
export function startCpuCount({ appPid, databasePid }) {
  if (process.platform !== "linux") return () => null;
  const read = () => ({ app: cpuMsWithChildren(appPid), database: cpuMsWithChildren(databasePid), generator: process.cpuUsage() });
  const before = read();
  return () => {
    const after = read();
    const generatorUs = process.cpuUsage(before.generator);
    return { app: after.app - before.app, database: after.database - before.database, generator: (generatorUs.user + generatorUs.system) / 1000 };
  };
}
