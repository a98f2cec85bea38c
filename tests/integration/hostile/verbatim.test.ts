import fc from "fast-check";
import { getTableName, is } from "drizzle-orm";
import { PgTable } from "drizzle-orm/pg-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import * as schema from "@/db/schema";
import { proposalRoutes } from "@/lib/server/api/proposal-routes";
import { noteCollectionRoutes, noteRoutes, targetCollectionRoutes, targetRoutes } from "@/lib/server/api/target-routes";
import { answerOf, expectDocumentedAnswer, sqlLookingTexts, type Answer } from "../support/hostile-input";
import { createWorld, pointTargetInput, type World } from "../support/world";

/**
 * Text that looks like SQL (or carries quotes, backslashes, dollar signs, placeholders and any
 * Unicode but NUL) is data: it is stored and read back exactly as sent, found by a search for it, and
 * the tables it names are still there afterwards (OWASP SQL Injection Prevention Cheat Sheet:
 * parameterized queries, and LIKE wildcards escaped).
 */

const runs = 40;
let world: World;

beforeAll(async () => {
  world = await createWorld();
});

afterAll(async () => {
  await dbClient().sql.end();
});

// Leading and trailing white space is trimmed by design (the schemas' `.trim()`), so the texts sent
// have none; NUL and unpaired surrogates are refused by design (lib/workspace/stored-text.ts).
const sqlFragment = fc.constantFrom(...sqlLookingTexts, "'", "''", '"', "\\", "\\\\", "%", "_", "$1", "$$", "--", "/*", "*/", ";", "\\0", "\\x00", "E'", "::", "\\'");
const anyText = fc.string({ unit: "binary", maxLength: 20 });
const verbatimText = (maxLength: number) =>
  fc
    .oneof(fc.constantFrom(...sqlLookingTexts), fc.array(fc.oneof(sqlFragment, anyText), { minLength: 1, maxLength: 6 }).map((parts) => parts.join("")))
    .map((text) => cutAt(text.trim(), maxLength).trim())
    .filter((text) => text.length > 0 && !text.includes("\u0000") && !/\p{Cs}/u.test(text));
// Names also refuse Unicode's direction controls and, being one line, control characters and line
// separators by design (nameText in lib/workspace/stored-text.ts).
const verbatimName = (maxLength: number) => verbatimText(maxLength).filter((text) => !/[\u202A-\u202E\u2066-\u2069\u0001-\u001F\u007F-\u009F\u2028\u2029]/u.test(text));

/** The first `length` UTF-16 units of `text`, never ending in half of a surrogate pair. */
const cutAt = (text: string, length: number) => text.slice(0, /[\uD800-\uDBFF]/.test(text.charAt(length - 1)) ? length - 1 : length);

const base = () => `http://arcwright.test/api/proposals/${world.proposalId}`;
const json = (method: string, url: string, body: unknown) => new Request(url, { method, body: JSON.stringify(body), headers: { "content-type": "application/json" } });
const context = <P>(params: P) => ({ params: Promise.resolve(params) });

async function expectAccepted(response: Response, status: number): Promise<Answer> {
  const answer = await answerOf(response);
  expectDocumentedAnswer(answer, { inputNames: [] });
  expect(answer.status, JSON.stringify(answer.body)).toBe(status);
  return answer;
}

describe("SQL-looking text is stored and shown verbatim", () => {
  const asPi = async () => world.actors.pi;

  it("target names: read back byte for byte, and a search for the name finds the target", async () => {
    await fc.assert(
      fc.asyncProperty(verbatimName(120), async (name) => {
        const created = await expectAccepted(await targetCollectionRoutes(asPi).POST(json("POST", `${base()}/targets`, { ...pointTargetInput, name }), context({ proposalId: world.proposalId })), 201);
        const id = (created.body as { target: { id: string; name: string } }).target.id;
        expect((created.body as { target: { name: string } }).target.name).toBe(name);
        const read = await expectAccepted(await targetRoutes(asPi).GET(new Request(`${base()}/targets/${id}`), context({ proposalId: world.proposalId, targetId: id })), 200);
        expect((read.body as { target: { name: string } }).target.name).toBe(name);
        const q = name.slice(0, 100).trim();
        const found = await expectAccepted(await targetCollectionRoutes(asPi).GET(new Request(`${base()}/targets?${new URLSearchParams({ q, pageSize: "200" })}`), context({ proposalId: world.proposalId })), 200);
        const rows = (found.body as { rows: { id: string; name: string }[] }).rows;
        expect(rows.map((r) => r.id)).toContain(id);
        // ILIKE with the pattern's own %, _ and \ escaped: every row found holds the text (case aside).
        for (const row of rows) expect(row.name.toLowerCase()).toContain(q.toLowerCase());
      }),
      { numRuns: runs },
    );
  });

  it("note bodies: created and edited text read back byte for byte, in the note and its history", async () => {
    const ids = { proposalId: world.proposalId, targetId: world.targetId };
    await fc.assert(
      fc.asyncProperty(verbatimText(20_000), verbatimText(20_000), async (first, second) => {
        const created = await expectAccepted(await noteCollectionRoutes(asPi).POST(json("POST", `${base()}/targets/${world.targetId}/notes`, { body: first }), context(ids)), 201);
        const note = (created.body as { note: { id: string; body: string; version: number } }).note;
        expect(note.body).toBe(first);
        const noteUrl = `${base()}/targets/${world.targetId}/notes/${note.id}`;
        await expectAccepted(await noteRoutes(asPi).PATCH(json("PATCH", noteUrl, { body: second, version: note.version }), context({ ...ids, noteId: note.id })), 200);
        const history = await expectAccepted(await noteRoutes(asPi).GET(new Request(noteUrl), context({ ...ids, noteId: note.id })), 200);
        const { note: stored, revisions } = history.body as { note: { body: string }; revisions: { version: number; body: string }[] };
        expect(stored.body).toBe(second);
        expect(revisions.map((r) => r.body)).toEqual([second, first]);
      }),
      { numRuns: runs },
    );
  });

  it("proposal titles, cycles and abstracts: read back byte for byte", async () => {
    const params = { proposalId: world.proposalId };
    await fc.assert(
      fc.asyncProperty(verbatimName(200), verbatimName(40), verbatimText(5000), async (title, cycle, abstract) => {
        const saved = await expectAccepted(await proposalRoutes(asPi).PATCH(json("PATCH", base(), { title, cycle, abstract }), context(params)), 200);
        expect((saved.body as { proposal: { title: string } }).proposal.title).toBe(title);
        const read = await expectAccepted(await proposalRoutes(asPi).GET(new Request(base()), context(params)), 200);
        expect((read.body as { proposal: { title: string; cycle: string; abstract: string } }).proposal).toMatchObject({ title, cycle, abstract });
      }),
      { numRuns: runs },
    );
  });

  // Unicode TR #36 (bidirectional spoofing), CVE-2021-42574: a name must read in the order it is stored.
  it("a direction override in a target name is a 400 naming the field, and nothing is stored; a note keeps it", async () => {
    const before = await dbClient().sql`select count(*)::int as n from targets where proposal_id = ${world.proposalId}`;
    const target = await answerOf(await targetCollectionRoutes(asPi).POST(json("POST", `${base()}/targets`, { ...pointTargetInput, name: "TB-ML\u202E71-1" }), context({ proposalId: world.proposalId })));
    expectDocumentedAnswer(target, { inputNames: ["name"] });
    expect(target.status).toBe(400);
    expect(Object.keys((target.body as { error: { fields: object } }).error.fields)).toEqual(["name"]);
    expect(await dbClient().sql`select count(*)::int as n from targets where proposal_id = ${world.proposalId}`).toEqual(before);
    const note = await expectAccepted(await noteCollectionRoutes(asPi).POST(json("POST", `${base()}/targets/${world.targetId}/notes`, { body: "seeing \u202E0.8" }), context({ proposalId: world.proposalId, targetId: world.targetId })), 201);
    expect((note.body as { note: { body: string } }).note.body).toBe("seeing \u202E0.8");
  });

  // Neither can be stored as sent: PostgreSQL text has no U+0000 (manual, "Character Types") and UTF-8
  // no half of a surrogate pair (RFC 3629 §3); refusing them is what keeps "read back as sent" true.
  for (const [what, bad] of [["a NUL", "\u0000"], ["an unpaired high surrogate", "\ud83d"], ["an unpaired low surrogate", "\udc00"]]) {
    it(`${what} in a target name, a note or a title is a 400 naming the field, and nothing is stored`, async () => {
      const before = await dbClient().sql`select count(*)::int as n from targets where proposal_id = ${world.proposalId}`;
      const target = await answerOf(await targetCollectionRoutes(asPi).POST(json("POST", `${base()}/targets`, { ...pointTargetInput, name: `TB${bad}'); DROP TABLE targets; --` }), context({ proposalId: world.proposalId })));
      const note = await answerOf(await noteCollectionRoutes(asPi).POST(json("POST", `${base()}/targets/${world.targetId}/notes`, { body: `seeing${bad}` }), context({ proposalId: world.proposalId, targetId: world.targetId })));
      const title = await answerOf(await proposalRoutes(asPi).PATCH(json("PATCH", base(), { title: `Arcs${bad}` }), context({ proposalId: world.proposalId })));
      for (const [answer, field] of [[target, "name"], [note, "body"], [title, "title"]] as const) {
        expectDocumentedAnswer(answer, { inputNames: [field] });
        expect(answer.status).toBe(400);
        expect(Object.keys((answer.body as { error: { fields: object } }).error.fields)).toEqual([field]);
      }
      expect(await dbClient().sql`select count(*)::int as n from targets where proposal_id = ${world.proposalId}`).toEqual(before);
    });
  }

  it("every table is still there afterwards, with the world's rows in it", async () => {
    const { sql } = dbClient();
    const tables = Object.values(schema).flatMap((value) => (is(value, PgTable) ? [getTableName(value)] : []));
    expect(tables.length).toBeGreaterThan(10);
    for (const table of tables) {
      const [{ exists }] = await sql`select to_regclass(${`public.${table}`}) is not null as exists`;
      expect(exists, table).toBe(true);
    }
    const [{ n }] = await sql`select count(*)::int as n from targets where proposal_id = ${world.proposalId}`;
    expect(n).toBeGreaterThan(0);
  });
});
