import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { dbClient } from "@/db/client";
import { proposals, targets } from "@/db/schema";
import { proposalRoutes } from "@/lib/server/api/proposal-routes";
import { getProposal, getProposalSky, updateProposal } from "@/lib/server/proposals";
import { createTarget, getTarget } from "@/lib/server/targets";
import { createWorld, proposalInput } from "./support/world";

afterAll(async () => {
  await dbClient().sql.end();
});

/** A compact object toward the Galactic Centre: 4 × 10⁶ M☉ at 8 kpc, the Sgr A*-like case. */
const compactTarget = {
  name: "TB-CO-0001",
  ra: "17 45 40.04",
  dec: "-29 00 28.1",
  lensModel: "point",
  lensMassSolar: 4e6,
  lensDistancePc: 8000,
  sourceDistancePc: 8500,
  sourceOffsetThetaE: 2,
  properMotionMasPerYr: 5,
  priority: 1,
};

const cycle = { cycleStartDate: "2031-03-01", cycleEndDate: "2031-08-30" };
const interferometer = { interferometerWavelengthMm: 1.3, interferometerBaselineKm: 10_700 };

describe("proposal settings", () => {
  it("stores cycle dates, airmass limit, λ and B, and defaults the airmass limit to 2", async () => {
    const world = await createWorld();
    const created = await getProposal({ proposalId: world.proposalId }, world.actors.viewer);
    expect(created).toMatchObject({ cycleStartDate: null, cycleEndDate: null, instrument: { airmassLimit: 2, interferometerWavelengthMm: null, interferometerBaselineKm: null } });
    const updated = await updateProposal(
      { proposalId: world.proposalId },
      { ...cycle, instrument: { ...proposalInput.instrument, airmassLimit: 1.5, ...interferometer } },
      world.actors.pi,
    );
    expect(updated).toMatchObject({ ...cycle, instrument: { airmassLimit: 1.5, ...interferometer } });
  });

  it("takes the interferometer's wavelength as 2.2 um or 230 GHz and stores millimetres (issue #15)", async () => {
    const world = await createWorld();
    const ids = { proposalId: world.proposalId };
    const instrument = { ...proposalInput.instrument, interferometerBaselineKm: "10700 km" };
    const infrared = await updateProposal(ids, { instrument: { ...instrument, interferometerWavelengthMm: "2.2 um" } }, world.actors.pi);
    expect(infrared.instrument).toMatchObject({ interferometerWavelengthMm: 0.0022, interferometerBaselineKm: 10_700 });
    // c = 299 792 458 m/s exactly (SI definition): c/230 GHz = 1.3034454695652173 mm, stored to 15 digits.
    const radio = await updateProposal(ids, { instrument: { ...instrument, interferometerWavelengthMm: "230 GHz" } }, world.actors.pi);
    expect(radio.instrument.interferometerWavelengthMm).toBe(1.30344546956522);
    const refused = updateProposal(ids, { instrument: { ...instrument, interferometerWavelengthMm: "5 kg" } }, world.actors.pi);
    await expect(refused).rejects.toMatchObject({
      code: "bad_request:proposal",
      message: expect.stringMatching(/^Interferometer wavelength: '5 kg' .*type e\.g\. 1\.3 mm or 230 GHz\.$/),
      fields: { "instrument.interferometerWavelengthMm": [expect.stringMatching(/^Interferometer wavelength: /)] },
    });
  });

  it("settings refused across fields say why in words (regression: 'Invalid proposal: check cycleEndDate')", async () => {
    const world = await createWorld();
    await expect(updateProposal({ proposalId: world.proposalId }, { cycleStartDate: "2031-03-01" }, world.actors.pi)).rejects.toMatchObject({
      code: "bad_request:proposal",
      message: "Give both the first and the last night of the cycle, or neither.",
    });
  });

  // Regression: the update schema once carried the create schema's default, so a PATCH of the title emptied the abstract.
  it("keeps fields a PATCH does not send", async () => {
    const world = await createWorld();
    const updated = await updateProposal({ proposalId: world.proposalId }, { title: "Renamed" }, world.actors.pi);
    expect(updated.title).toBe("Renamed");
    expect(updated.abstract).toBe(proposalInput.abstract);
  });

  it("re-grades targets on an update: the case, the shadow against λ/B and the schedule's visits", async () => {
    const world = await createWorld();
    const ids = { proposalId: world.proposalId };
    // The team chose horizon-scale imaging for the compact object.
    const created = await createTarget(ids, { ...compactTarget, scienceCase: "horizon-scale" }, world.actors.pi);
    const answersNow = async (targetId = created.id) => {
      const target = await getTarget({ ...ids, targetId }, world.actors.coi);
      return { scienceCase: target.answeredCase, byId: Object.fromEntries(target.caseAnswers.map((answer) => [answer.id, answer])) };
    };
    const before = await answersNow();
    // Without an interferometer the shadow cannot be graded: the answer says which inputs to set.
    expect(before.scienceCase).toBe("horizon-scale");
    expect(before.byId.shadow).toMatchObject({ verdict: "unknown", sentence: expect.stringMatching(/wavelength/) });
    // The world's microlens: separation 2.02 θE ≈ 1.29 mas against 60 mas, unresolved: a photometric event too.
    expect((await answersNow(world.targetId)).scienceCase).toBe("photometric-microlensing");

    await updateProposal(ids, { ...cycle, instrument: { ...proposalInput.instrument, resolutionMas: 0.02, ...interferometer } }, world.actors.pi);
    const after = await answersNow();
    // λ/B = 1.3 mm / 10,700 km = 1.215e-10 rad = 25.06 µas; the shadow of 4e6 M☉ at 8 kpc is
    // 2√27 GM/(c² D) = 51.3 µas, about 2.05 λ/B: feasible.
    expect(after.byId.shadow.verdict).toBe("feasible");
    expect(after.byId.shadow.figure).toMatch(/2\.0\d/);
    expect(after.byId["photon-ring"]).toBeDefined();
    // The lensing scales re-graded in SQL: 1.29 mas against 0.02 mas now resolves the world's microlens.
    expect((await answersNow(world.targetId)).scienceCase).toBe("resolved-images");
  });

  it("refuses inconsistent settings with field errors and writes nothing", async () => {
    const world = await createWorld();
    const ids = { proposalId: world.proposalId };
    await expect(updateProposal(ids, { cycleStartDate: "2031-03-01" }, world.actors.pi)).rejects.toMatchObject({
      code: "bad_request:proposal",
      fields: { cycleEndDate: expect.any(Array) },
    });
    await expect(updateProposal(ids, { cycleStartDate: "2031-03-01", cycleEndDate: "2031-02-01" }, world.actors.pi)).rejects.toMatchObject({
      fields: { cycleEndDate: ["The last night comes on or after the first."] },
    });
    await expect(updateProposal(ids, { cycleStartDate: "2031-02-30", cycleEndDate: "2031-03-01" }, world.actors.pi)).rejects.toMatchObject({
      fields: { cycleStartDate: expect.any(Array) },
    });
    await expect(
      updateProposal(ids, { title: "Should not land", instrument: { ...proposalInput.instrument, interferometerWavelengthMm: 1.3 } }, world.actors.pi),
    ).rejects.toMatchObject({ fields: { "instrument.interferometerBaselineKm": expect.any(Array) } });
    await expect(updateProposal(ids, { instrument: { ...proposalInput.instrument, airmassLimit: 0.5 } }, world.actors.pi)).rejects.toMatchObject({
      fields: { "instrument.airmassLimit": expect.any(Array) },
    });
    const [row] = await dbClient().db.select().from(proposals).where(eq(proposals.id, world.proposalId));
    expect(row).toMatchObject({ title: proposalInput.title, cycleStartDate: null, interferometerWavelengthMm: null, airmassLimit: 2 });
  });

  it("lets a viewer read the sky positions but not edit the proposal", async () => {
    const world = await createWorld();
    const ids = { proposalId: world.proposalId };
    const sky = await getProposalSky(ids, world.actors.viewer);
    expect(sky.total).toBe(1);
    expect(sky.targets[0].raDeg).toBeCloseTo(269.3016667, 6);
    const patch = proposalRoutes(async () => world.actors.viewer).PATCH;
    const response = await patch(
      new Request(`http://arcwright.test/api/proposals/${world.proposalId}`, { method: "PATCH", body: JSON.stringify({ ...cycle, title: "Viewer edit" }), headers: { "content-type": "application/json" } }),
      { params: Promise.resolve(ids) },
    );
    expect(response.status).toBe(403);
    expect((await response.json()).error.code).toBe("forbidden:proposal");
    const [row] = await dbClient().db.select().from(proposals).where(eq(proposals.id, world.proposalId));
    expect(row).toMatchObject({ title: proposalInput.title, cycleStartDate: null });
    const rows = await dbClient().db.select().from(targets).where(eq(targets.proposalId, world.proposalId));
    expect(rows).toHaveLength(1);
  });
});
