import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { memberRoutes } from "@/lib/server/api/member-routes";
import { proposalRoutes } from "@/lib/server/api/proposal-routes";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";
import { noteRoutes, targetRoutes } from "@/lib/server/api/target-routes";
import { everyTargetField, proposalSnapshot } from "../support/hostile-endpoints";
import { answerOf, expectDocumentedAnswer, hostileValue, jsonText, RawJson, type Answer } from "../support/hostile-input";
import { createWorld, proposalInput, type World } from "../support/world";

/**
 * A refused change writes nothing: every PATCH below carries good changes together with one that
 * must be refused, some only after the body has parsed (a check across fields, a status move, a stale
 * version, the last PI), and afterwards everything stored for the proposal is as it was: the row, its
 * derived columns and `updatedAt`, the activity feed (all or nothing, as in a database transaction).
 */

const runs = 30;
let world: World;

beforeAll(async () => {
  world = await createWorld();
});

afterAll(async () => {
  await dbClient().sql.end();
});

const base = () => `http://arcwright.test/api/proposals/${world.proposalId}`;
const patch = (url: string, body: unknown) => new Request(url, { method: "PATCH", body: jsonText(body), headers: { "content-type": "application/json" } });
const context = <P>(params: P) => ({ params: Promise.resolve(params) });

/** Sends the PATCH and checks it was refused in the documented shape and changed nothing stored. */
async function expectRefusedWithoutWrites(send: () => Promise<Response>, inputNames: string[]): Promise<Answer> {
  const before = await proposalSnapshot(world);
  const answer = await answerOf(await send());
  expectDocumentedAnswer(answer, { inputNames });
  expect(answer.status, JSON.stringify(answer.body)).toBeGreaterThanOrEqual(400);
  expect(await proposalSnapshot(world), `a ${answer.status} changed stored data`).toBe(before);
  return answer;
}

/** Changes that would be accepted on their own. */
const goodTargetChanges = fc.record(
  { name: fc.constantFrom("TB-ML-0001-renamed", "Renamed'); --"), priority: fc.integer({ min: 1, max: 5 }), tags: fc.constantFrom(["renamed"], []), lensMassSolar: fc.constantFrom(0.2, 3), sourceOffsetThetaE: fc.constantFrom(0.1, 2) },
  { requiredKeys: [] },
);

/** One change the target must refuse: by its schema, or only on the merged record. */
const poisonedTargetChange = fc.oneof(
  fc.record({ lensDistancePc: fc.constantFrom(8000, 9000, 1e9) }), // the source (8000 pc) must lie behind the lens
  fc.record({ sourceDistancePc: fc.constantFrom(4000, 100) }), // … in front of the lens (4000 pc)
  fc.record({ status: fc.constantFrom("scheduled", "observed") }), // a candidate moves only to accepted or dropped
  fc.record({ lensModel: fc.constant("sis") }), // an isothermal lens needs its velocity dispersion
  fc.record({ lensRedshift: fc.constant(0.3), sourceRedshift: fc.constant(1) }), // distances and redshifts both given
  fc.record({ lensMassSolar: fc.constant(null) }), // a point lens needs its mass
  fc.record({ dec: fc.constantFrom("-95 00 00", "+90 00 01", "") }),
  fc.record({ ra: fc.constantFrom<unknown>(null, true, [], {}, "24 00 00", "-01 00 00", "360", "17 57 60", new RawJson("1e309")) }),
  // Typed text is read as the form sends it ("1" is priority 1), so the text refused here is not a number.
  fc.record({ priority: fc.constantFrom<unknown>(0, 6, 2.5, "first", "1 kpc", null, new RawJson("-0"), new RawJson("1e309")) }),
);

describe("a refused PATCH writes nothing", () => {
  it("targets: good changes alongside one refused change leave the row, its derived columns and the feed unchanged", async () => {
    const params = { proposalId: world.proposalId, targetId: world.targetId };
    await fc.assert(
      fc.asyncProperty(goodTargetChanges, poisonedTargetChange, async (good, poison) => {
        const answer = await expectRefusedWithoutWrites(() => targetRoutes(async () => world.actors.pi).PATCH(patch(`${base()}/targets/${world.targetId}`, { ...good, ...poison }), context(params)), Object.keys(everyTargetField).concat("status"));
        expect(answer.status).toBe(400);
      }),
      { numRuns: runs },
    );
  });

  it("proposals: a title change alongside inconsistent cycle dates or interferometer settings is not applied", async () => {
    const params = { proposalId: world.proposalId };
    const poison = fc.oneof(
      fc.constant({ cycleStartDate: "2031-03-01" }), // both nights or neither
      fc.constant({ cycleStartDate: "2031-03-01", cycleEndDate: "2031-02-01" }), // the last night before the first
      fc.constant({ cycleStartDate: "2031-02-30", cycleEndDate: "2031-03-01" }), // no such date
      fc.constant({ instrument: { ...proposalInput.instrument, interferometerWavelengthMm: 1.3 } }), // wavelength without baseline
      fc.constant({ site: { ...proposalInput.site, latitudeDeg: 91 } }),
      fc.record({ instrument: fc.record({ ...Object.fromEntries(Object.entries(proposalInput.instrument).map(([k, v]) => [k, fc.constant(v)])), resolutionMas: hostileValue }) }).filter((b) => !instrumentSchema.safeParse(JSON.parse(jsonText(b.instrument))).success), // only what the schema refuses once sent (raw 1E2 is a number)
    );
    await fc.assert(
      fc.asyncProperty(fc.constantFrom("Renamed proposal", "'); DROP TABLE proposals; --"), poison, async (title, bad) => {
        const answer = await expectRefusedWithoutWrites(() => proposalRoutes(async () => world.actors.pi).PATCH(patch(base(), { title, abstract: "changed", ...bad }), context(params)), Object.keys(proposalInput).concat("cycleStartDate", "cycleEndDate"));
        expect(answer.status).toBe(400);
      }),
      { numRuns: runs },
    );
  });

  it("notes: a save from a version that is not the note's is a 409 and leaves the note and its history as they were", async () => {
    const params = { proposalId: world.proposalId, targetId: world.targetId, noteId: world.noteId };
    const url = `${base()}/targets/${world.targetId}/notes/${world.noteId}`;
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 2, max: 2_147_483_647 }), fc.constantFrom("Overwritten.", "'); DELETE FROM note_revisions; --"), async (version, body) => {
        const answer = await expectRefusedWithoutWrites(() => noteRoutes(async () => world.actors.pi).PATCH(patch(url, { body, version }), context(params)), ["body", "version"]);
        expect(answer.status).toBe(409);
      }),
      { numRuns: runs },
    );
  });

  it("members: demoting the only PI is a 409 and leaves every membership as it was", async () => {
    const params = { proposalId: world.proposalId, userId: world.actors.pi.userId };
    const url = `${base()}/members/${world.actors.pi.userId}`;
    for (const role of ["coi", "viewer"]) {
      const answer = await expectRefusedWithoutWrites(() => memberRoutes(async () => world.actors.pi).PATCH(patch(url, { role }), context(params)), ["role"]);
      expect(answer.status).toBe(409);
    }
  });
});
