import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

/**
 * Three projects: `unit` (pure logic, parallel), `integration` (route handlers and data access
 * against the real PostgreSQL that `npm test` starts; files in parallel, one database per worker) and
 * `e2e` (playwright-core driving Debian's Chromium against the built app that `npm test` serves).
 * Property tests (fast-check) run with one fixed seed (tests/support/property-seed.ts).
 */
export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    // Tests call the server-only data-access modules directly; outside React's server build the
    // marker package would throw, so point it at its own empty entry.
    alias: { "server-only": fileURLToPath(new URL("./node_modules/server-only/empty.js", import.meta.url)) },
  },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: "unit",
          environment: "node",
          include: ["tests/unit/**/*.test.ts"],
          setupFiles: ["tests/support/property-seed.ts"],
          // Unit tests are pure (no shared state, no environment changes; the one module mock,
          // in sign-in-page.test.ts, replaces a component no other unit test imports), so their
          // files share one module cache: the same 1,100 tests in ~20 s instead of ~100 s, most of
          // which was re-importing the physics and lensing modules for every file.
          isolate: false,
        },
      },
      {
        extends: true,
        test: {
          name: "integration",
          environment: "node",
          include: ["tests/integration/**/*.test.ts"],
          // Files run in parallel workers, each on its own copy of the database (`npm test` makes them).
          setupFiles: ["tests/support/worker-database.ts", "tests/support/property-seed.ts"],
          // Files share a worker's loaded packages (Node caches them) instead of a fresh worker each;
          // worker-database.ts gives every file fresh project modules and the worker's starting
          // environment, which is what isolation gave them here.
          isolate: false,
          testTimeout: 20_000,
          hookTimeout: 30_000,
          server: { deps: { inline: ["next-auth"] } },
        },
      },
      {
        extends: true,
        test: {
          name: "e2e",
          environment: "node",
          include: ["tests/e2e/**/*.test.ts"],
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
