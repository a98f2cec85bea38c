import { createServer } from "node:net";
import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { afterAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import * as schema from "@/db/schema";
import { checkDatabase } from "@/lib/server/health";
import { GET } from "@/app/api/health/route";

/** A loopback port that nothing listens on (taken and released at once). */
function closedPort(): Promise<number> {
  return new Promise((resolve) => {
    const server = createServer().listen(0, "127.0.0.1", () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

afterAll(async () => {
  await dbClient().sql.end();
});

describe("database health", () => {
  it("GET /api/health answers 200 ok after a real query", async () => {
    const response = await GET();
    expect(response.status).toBe(200);
    await expect(response.json()).resolves.toMatchObject({ status: "ok", database: "ok" });
  });

  it("reports the database down, with a reason, when nothing listens on its port", async () => {
    const port = await closedPort();
    const dead = postgres(`postgres://nobody:x@127.0.0.1:${port}/none`, { max: 1, connect_timeout: 2, onnotice: () => {} });
    const started = Date.now();
    const health = await checkDatabase(drizzle(dead, { schema }));
    expect(health.ok).toBe(false);
    expect(health.ok ? "" : health.reason).toMatch(/ECONNREFUSED|unreachable/);
    expect(Date.now() - started).toBeLessThan(5_000);
    await dead.end();
  });
});
