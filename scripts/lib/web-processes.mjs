// How many `next start` processes scripts/serve.mjs runs: ARCWRIGHT_WEB_PROCESSES, or the cores Node may use.
import { availableParallelism } from "node:os";

/** The process count from `env`; throws on a value that is not a whole number of at least 1. */
export function webProcessCount(env = process.env) {
  const given = env.ARCWRIGHT_WEB_PROCESSES;
  if (given === undefined || given === "") return availableParallelism();
  const count = Number(given);
  if (!Number.isInteger(count) || count < 1) throw new Error(`ARCWRIGHT_WEB_PROCESSES must be a whole number of at least 1, got ${given}`);
  return count;
}
