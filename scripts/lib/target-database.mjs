// Which database a maintenance command works on: DATABASE_URL when set, else the `npm start` cluster
// in .data/ (started for the command and stopped again if it was not running).
import { join } from "node:path";
import { Cluster } from "./postgres.mjs";
import { loadOrCreateSecrets } from "./secrets.mjs";
import { log } from "./log.mjs";

/**
 * @param {string} repoRoot
 * @param {{ database?: string }} [options] a database of the local cluster other than `arcwright`
 * @returns {{ url: string, cluster?: Cluster, done: () => void }}
 */
export function openTargetDatabase(repoRoot, { database = "arcwright" } = {}) {
  if (process.env.DATABASE_URL) return { url: process.env.DATABASE_URL, done: () => {} };
  const stateDir = join(repoRoot, ".data");
  const secrets = loadOrCreateSecrets(stateDir);
  const cluster = new Cluster({
    root: join(stateDir, "postgres"),
    port: Number(process.env.ARCWRIGHT_DB_PORT ?? 54329),
    password: secrets.postgresPassword,
  });
  if (!cluster.isInitialized) throw new Error("No local database yet: run `npm start` once first, or set DATABASE_URL.");
  const wasRunning = cluster.isRunning;
  if (!wasRunning) {
    log("postgres", "starting the local cluster for this command");
    cluster.start();
  }
  return { url: cluster.url(database), cluster, done: () => (wasRunning ? undefined : cluster.stop()) };
}
