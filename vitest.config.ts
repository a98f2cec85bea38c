import { defineConfig } from "vitest/config";

/**
 * Two projects: `unit` (pure logic, parallel) and `integration` (route handlers and data access
 * against the real PostgreSQL that `npm test` starts; one file at a time because they share it).
 */
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: "unit",
          environment: "node",
          include: ["tests/unit/**/*.test.ts"],
        },
      },
      {
        extends: true,
        test: {
          name: "integration",
          environment: "node",
          include: ["tests/integration/**/*.test.ts"],
          fileParallelism: false,
          testTimeout: 20_000,
          hookTimeout: 30_000,
          server: { deps: { inline: ["next-auth"] } },
        },
      },
    ],
  },
});
