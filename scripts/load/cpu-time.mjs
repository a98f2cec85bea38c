// CPU time spent by the processes of a run, read from Linux's /proc. On a machine shared with other
// work, latency says how busy the machine was; CPU time per request says what a request costs.
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";

/** /proc/<pid>/stat counts in clock ticks; Linux reports them at USER_HZ = 100 on every common build. */
const msPerTick = 10;

/** utime + stime of one process in ms, and its parent's pid; undefined once it has exited. */
function statOf(pid) {
  try {
    // The command name (field 2) may hold spaces and parentheses: the fields that follow come after the last ")".
    const text = readFileSync(`/proc/${pid}/stat`, "utf8");
    const fields = text.slice(text.lastIndexOf(")") + 2).split(" ");
    return { parentPid: Number(fields[1]), cpuMs: (Number(fields[11]) + Number(fields[12])) * msPerTick };
  } catch {
    return undefined;
  }
}

/** CPU ms of a process and of its direct children (a PostgreSQL server and its backends; the app's `next start` processes). */
function cpuMsWithChildren(pid) {
  let total = statOf(pid)?.cpuMs ?? 0;
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    const stat = statOf(entry);
    if (stat?.parentPid === pid) total += stat.cpuMs;
  }
  return total;
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
