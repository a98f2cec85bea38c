/**
 * Integration test files run in parallel workers, each on a database of its own: `npm test` copies
 * the migrated test database once per worker (scripts/test.mjs, ARCWRIGHT_WORKER_DATABASES) and this
 * setup file points the worker's DATABASE_URL at its copy before any test module reads the settings.
 * Vitest numbers its workers 1..maxWorkers in VITEST_POOL_ID. Without the variable (a single file run
 * by hand against one database) nothing changes.
 */
const workerDatabases = Number(process.env.ARCWRIGHT_WORKER_DATABASES ?? 0);
const poolId = Number(process.env.VITEST_POOL_ID ?? 0);

if (workerDatabases > 0 && process.env.DATABASE_URL) {
  if (!(poolId >= 1 && poolId <= workerDatabases)) {
    throw new Error(`Integration worker ${process.env.VITEST_POOL_ID} has no database of its own (${workerDatabases} were made).`);
  }
  const url = new URL(process.env.DATABASE_URL);
  url.pathname = `${url.pathname}_w${poolId}`;
  process.env.DATABASE_URL = url.toString();
}
