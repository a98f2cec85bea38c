/**
 * Integration test files run in parallel workers, each on a database of its own: `npm test` copies
 * the migrated test database once per worker (scripts/test.mjs, ARCWRIGHT_WORKER_DATABASES) and this
 * setup file points the worker's DATABASE_URL at its copy before any test module reads the settings.
 * Vitest numbers its workers 1..maxWorkers in VITEST_POOL_ID. Without the variable (a single file run
 * by hand against one database) nothing changes.
 */
import { vi } from "vitest";

/**
 * Files of a worker run one after another in one process (`isolate: false`): each starts from the
 * worker's environment as it was before the first file (a file's mail catcher or upload fake sets
 * SMTP_PORT, UPLOADTHING_…), with fresh project modules (the validated environment is module state)
 * and a database client of its own, while the packages stay loaded.
 */
const globals = globalThis as { arcwrightStartingEnv?: Record<string, string | undefined> };
globals.arcwrightStartingEnv ??= { ...process.env };
for (const name of Object.keys(process.env)) if (!(name in globals.arcwrightStartingEnv)) delete process.env[name];
Object.assign(process.env, globals.arcwrightStartingEnv);
vi.resetModules();
// db/client.ts keeps its pool on globalThis (for the dev server's reloads): a file's own client, then.
const kept = globalThis as { arcwrightDb?: { sql: { end(options?: { timeout?: number }): Promise<void> } } };
const previousClient = kept.arcwrightDb;
delete kept.arcwrightDb;
await previousClient?.sql.end({ timeout: 5 });

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
