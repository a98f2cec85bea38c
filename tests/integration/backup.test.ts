import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, existsSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import postgres from "postgres";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { serverEnv } from "@/lib/env";

// The round trip of `npm run db:backup` and `npm run db:restore`, on the test cluster.
const sourceUrl = serverEnv().DATABASE_URL;
const restoredName = `restored_${process.pid}`;
const restoredUrl = sourceUrl.replace(/\/[^/]+$/, `/${restoredName}`);
const admin = postgres(sourceUrl.replace(/\/[^/]+$/, "/postgres"), { max: 1, onnotice: () => {} });
const source = postgres(sourceUrl, { max: 1, onnotice: () => {} });
const workDir = mkdtempSync(join(tmpdir(), "arcwright-backup-"));
const dumpFile = join(workDir, "backup.dump");
const marker = `backup-round-trip-${Date.now()}`;

function script(name: string, args: string[], databaseUrl: string) {
  return spawnSync(process.execPath, [join("scripts", name), ...args], {
    encoding: "utf8",
    env: { ...process.env, DATABASE_URL: databaseUrl },
  });
}

/** Row count of every table in the public and drizzle schemas, by qualified name. */
async function tableCounts(url: string): Promise<Record<string, number>> {
  const sql = postgres(url, { max: 1, onnotice: () => {} });
  try {
    const tables = await sql<{ name: string }[]>`
      select schemaname || '.' || tablename as name from pg_tables
      where schemaname in ('public', 'drizzle') order by 1`;
    const counts: Record<string, number> = {};
    for (const { name } of tables) {
      const [row] = await sql.unsafe(`select count(*)::int as n from ${name.split(".").map((p) => `"${p}"`).join(".")}`);
      counts[name] = row.n as number;
    }
    return counts;
  } finally {
    await sql.end();
  }
}

beforeAll(async () => {
  await source`insert into seed_runs (name) values (${marker})`;
  await admin.unsafe(`create database ${restoredName}`);
});

afterAll(async () => {
  await source`delete from seed_runs where name = ${marker}`;
  await source.end();
  await admin.unsafe(`drop database if exists ${restoredName} with (force)`);
  await admin.end();
  rmSync(workDir, { recursive: true, force: true });
});

describe("database backup and restore", () => {
  it("dumps the database and restores every table and row into an empty database", async () => {
    const backup = script("db-backup.mjs", ["--out", dumpFile], sourceUrl);
    expect(backup.status, backup.stderr).toBe(0);
    expect(existsSync(dumpFile)).toBe(true);
    expect(existsSync(`${dumpFile}.partial`)).toBe(false);

    const restore = script("db-restore.mjs", [dumpFile], restoredUrl);
    expect(restore.status, restore.stderr).toBe(0);

    const before = await tableCounts(sourceUrl);
    const after = await tableCounts(restoredUrl);
    expect(Object.keys(before).length).toBeGreaterThan(1);
    expect(after).toEqual(before);
    const restored = postgres(restoredUrl, { max: 1, onnotice: () => {} });
    const rows = await restored`select name from seed_runs where name = ${marker}`;
    await restored.end();
    expect(rows).toHaveLength(1);
  });

  it("refuses to restore into a database that already holds tables, and leaves it unchanged", async () => {
    const before = await tableCounts(sourceUrl);
    const restore = script("db-restore.mjs", [dumpFile], sourceUrl);
    expect(restore.status).not.toBe(0);
    expect(restore.stderr).toMatch(/not empty/);
    expect(await tableCounts(sourceUrl)).toEqual(before);
  });

  it("names a missing backup file", () => {
    const restore = script("db-restore.mjs", [join(workDir, "nope.dump")], restoredUrl);
    expect(restore.status).not.toBe(0);
    expect(restore.stderr).toMatch(/no such backup file/);
  });
});
