// Processes as Linux's /proc shows them: the load run counts CPU time with these, and the launcher's
// tests find the `next start` processes of a launcher.
import { readdirSync, readFileSync } from "node:fs";

/** /proc/<pid>/stat counts in clock ticks; Linux reports them at USER_HZ = 100 on every common build. */
const msPerTick = 10;

/** A process's state letter, parent's pid and CPU time (utime + stime, ms); undefined once it has exited. */
export function processStat(pid) {
  try {
    // The command name (field 2) may hold spaces and parentheses: the fields that follow come after the last ")".
    const text = readFileSync(`/proc/${pid}/stat`, "utf8");
    const fields = text.slice(text.lastIndexOf(")") + 2).split(" ");
    return { state: fields[0], parentPid: Number(fields[1]), cpuMs: (Number(fields[11]) + Number(fields[12])) * msPerTick };
  } catch {
    return undefined;
  }
}

/** The pids of the children of `pid` that are alive (zombies, exited but not yet reaped, left out). */
export function childPids(pid) {
  return readdirSync("/proc")
    .filter((entry) => /^\d+$/.test(entry))
    .filter((entry) => {
      const stat = processStat(entry);
      return stat !== undefined && stat.parentPid === pid && stat.state !== "Z";
    })
    .map(Number);
}
