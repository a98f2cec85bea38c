import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { orbitingStar } from "@/db/seed/demo-scenario";
import { demoCycle } from "@/db/seed/demo-sky-cycle";
import { targetTableExportRoutes } from "@/lib/server/api/export-routes";
import { AppError } from "@/lib/errors";
import { previewImport } from "@/lib/server/imports";
import { getProposal, updateProposal } from "@/lib/server/proposals";
import { createTarget, getTarget, updateTarget } from "@/lib/server/targets";
import { feasibilitySettingsOf } from "@/lib/server/derived-columns";
import { deriveTargetColumns, targetSchedules } from "@/lib/workspace/derived";
import type { Actor } from "@/lib/server/actor";
import { proposals } from "@/db/schema";
import { eq } from "drizzle-orm";
import { createWorld, type World } from "./support/world";
import { startUploadService, type UploadService } from "./support/upload-service";

/**
 * A target with an orbiting star saved through the data access, its relativistic-orbit answers read
 * back, its elements exported and imported again, and the refusals in words.
 */

let service: UploadService;

beforeAll(async () => {
  service = await startUploadService();
});

afterAll(async () => {
  await service.stop();
  await dbClient().sql.end();
});

/** The demo's invented star as the form would send it: the elements typed with their units. */
const orbitTarget = {
  name: "Larkspur-3 b",
  ra: orbitingStar.ra,
  dec: orbitingStar.dec,
  lensModel: "point",
  lensMassSolar: "5.2e6 Msun",
  lensDistancePc: "8.3 kpc",
  sourceDistancePc: "9 kpc",
  sourceOffsetThetaE: "2",
  scienceCase: "relativistic-orbit",
  orbitSemiMajorAxisAu: "700 au",
  orbitEccentricity: "0.93",
  orbitPeriapsisJdUtc: "2031-05-20 12:00",
  orbitInclinationDeg: "122 deg",
  orbitNodeDeg: "61",
  orbitPeriapsisArgumentDeg: "248°",
  priority: 1,
  tags: ["orbit"],
};

/** A world whose proposal has the demo cycle and a 15 km/s spectrograph. */
async function orbitWorld(): Promise<World> {
  const world = await createWorld();
  const proposal = await getProposal({ proposalId: world.proposalId }, world.actors.pi);
  await updateProposal({ proposalId: world.proposalId }, { ...demoCycle, instrument: { ...proposal.instrument, spectroscopicPrecisionKmPerS: "15 km/s" } }, world.actors.pi);
  return world;
}

async function refusalOf(action: Promise<unknown>): Promise<AppError> {
  const error = await action.then(
    () => null,
    (caught: unknown) => caught,
  );
  if (!(error instanceof AppError)) throw new Error(`expected a refusal, got ${String(error)}`);
  return error;
}

describe("a target with an orbiting star", () => {
  it("is saved with its elements in their stored units and answers the relativistic-orbit case against the proposal's spectrograph", async () => {
    const world = await orbitWorld();
    const created = await createTarget({ proposalId: world.proposalId }, orbitTarget, world.actors.pi);
    const target = await getTarget({ proposalId: world.proposalId, targetId: created.id }, world.actors.viewer);
    // 2031-05-20 12:00 UTC: JD 2463007.0 (astropy 5.2.1, Time("2031-05-20 12:00", scale="utc").jd).
    expect(target).toMatchObject({ orbitSemiMajorAxisAu: 700, orbitSemiMajorAxisMas: null, orbitEccentricity: 0.93, orbitPeriapsisJdUtc: 2463007, orbitInclinationDeg: 122, orbitNodeDeg: 61, orbitPeriapsisArgumentDeg: 248 });
    expect(target.answeredCase).toBe("relativistic-orbit");
    // The case's four questions, then the photon budget's depth (which says the proposal has no camera).
    expect(target.caseAnswers.map((answer) => answer.id)).toEqual(["periapsis-season", "periapsis-epochs", "precession-signal", "redshift-signal", "depth"]);
    // GM/(c² r_p) + v_p²/(2c²) with r_p = 49 au about 5.2 × 10⁶ M☉ is about 617 km/s (c·z), 41 × 15 km/s: one epoch detects it.
    const redshift = target.caseAnswers.find((answer) => answer.id === "redshift-signal")!;
    expect(redshift.verdict).toBe("feasible");
    expect(redshift.figure).toMatch(/^617 km\/s = 41\.1 × the precision \(15 km\/s\)$/);
    // The stored answers are what the derivation gives for the saved row under the proposal as stored.
    const [row] = await dbClient().db.select().from(proposals).where(eq(proposals.id, world.proposalId));
    const settings = feasibilitySettingsOf(row);
    const expected = deriveTargetColumns(target, settings, targetSchedules(settings, [target])[0]);
    expect(target.caseAnswers).toEqual(expected.caseAnswers);
  });

  it("takes the semi-major axis as an angle at the lens distance in its own column", async () => {
    const world = await orbitWorld();
    const { orbitSemiMajorAxisAu: _au, ...rest } = orbitTarget;
    const created = await createTarget({ proposalId: world.proposalId }, { ...rest, name: "Larkspur-3 b (angle)", orbitSemiMajorAxisMas: "0.08434 arcsec" }, world.actors.pi);
    expect([created.orbitSemiMajorAxisAu, created.orbitSemiMajorAxisMas]).toEqual([null, 84.34]);
    expect(created.answeredCase).toBe("relativistic-orbit");
    expect(created.caseAnswers.find((answer) => answer.id === "redshift-signal")!.verdict).toBe("feasible");
  });

  it("is refused in words on a lens that is no point mass, and cannot become one", async () => {
    const world = await orbitWorld();
    const sis = { ...orbitTarget, name: "Galaxy with a star", lensModel: "sis", lensMassSolar: null, velocityDispersionKmPerS: 250 };
    const refused = await refusalOf(createTarget({ proposalId: world.proposalId }, sis, world.actors.pi));
    expect(refused.code).toBe("bad_request:target");
    expect(refused.fields?.orbitSemiMajorAxisAu).toEqual([
      "An orbiting star's elements describe an orbit around a compact mass: this target has a singular isothermal sphere lens. Change its lens model to a point mass, or clear the orbit's fields.",
    ]);
    const created = await createTarget({ proposalId: world.proposalId }, orbitTarget, world.actors.pi);
    const switched = await refusalOf(updateTarget({ proposalId: world.proposalId, targetId: created.id }, { lensModel: "sis", lensMassSolar: null, velocityDispersionKmPerS: 250 }, world.actors.pi));
    expect(Object.keys(switched.fields ?? {})).toEqual(["orbitSemiMajorAxisAu"]);
  });

  it("is exported with its elements and read back from our own VOTable into another proposal with every digit", async () => {
    const world = await orbitWorld();
    await createTarget({ proposalId: world.proposalId }, orbitTarget, world.actors.pi);
    const votable = await (await download(world.actors.viewer, world.proposalId, everyOrbitColumn)).text();
    expect(votable).toContain('name="orbitNodeDeg"');
    const other = await createWorld();
    const upload = await service.uploadAs(other.actors.coi, "targetList", { proposalId: other.proposalId }, { name: "orbit.vot", bytes: new TextEncoder().encode(votable), type: "application/x-votable+xml" });
    if (upload.stage !== "stored" || !upload.serverData.ok) throw new Error(`upload refused: ${JSON.stringify(upload)}`);
    const preview = await previewImport({ proposalId: other.proposalId }, { fileId: upload.serverData.fileId }, other.actors.coi);
    const row = preview.rows.find((r) => r.cells.name === "Larkspur-3 b")!;
    expect(row.errors).toEqual([]);
    expect(row.action).toBe("add");
    expect(row.values).toMatchObject({ orbitSemiMajorAxisAu: 700, orbitEccentricity: 0.93, orbitPeriapsisJdUtc: 2463007, orbitInclinationDeg: 122, orbitNodeDeg: 61, orbitPeriapsisArgumentDeg: 248, scienceCase: "relativistic-orbit" });
  });

  it("read back into its own proposal, the same table leaves the target unchanged (the import compares the orbit's elements too)", async () => {
    const world = await orbitWorld();
    await createTarget({ proposalId: world.proposalId }, orbitTarget, world.actors.pi);
    const votable = await (await download(world.actors.viewer, world.proposalId, everyOrbitColumn)).text();
    const upload = await service.uploadAs(world.actors.coi, "targetList", { proposalId: world.proposalId }, { name: "orbit.vot", bytes: new TextEncoder().encode(votable), type: "application/x-votable+xml" });
    if (upload.stage !== "stored" || !upload.serverData.ok) throw new Error(`upload refused: ${JSON.stringify(upload)}`);
    const preview = await previewImport({ proposalId: world.proposalId }, { fileId: upload.serverData.fileId }, world.actors.coi);
    const row = preview.rows.find((r) => r.cells.name === "Larkspur-3 b")!;
    expect(row.errors).toEqual([]);
    expect([row.action, row.detail]).toEqual(["skip", expect.stringContaining("unchanged")]);
  });
});

/** Our VOTable of the hypothesis and every orbit column, the periapsis time with every digit. */
const everyOrbitColumn =
  "format=votable&columns=name,raDeg,decDeg,lensModel,lensMassSolar,lensDistancePc,sourceDistancePc,sourceOffsetThetaE,scienceCase,orbitSemiMajorAxisAu,orbitSemiMajorAxisMas,orbitEccentricity,orbitPeriodDays,orbitPeriapsisJdUtc,orbitInclinationDeg,orbitNodeDeg,orbitPeriapsisArgumentDeg,priority&digits=orbitPeriapsisJdUtc:17";

async function download(actor: Actor, proposalId: string, query: string) {
  const request = new Request(`http://arcwright.test/api/proposals/${proposalId}/exports/targets?${query}`);
  return targetTableExportRoutes(async () => actor).GET(request, { params: Promise.resolve({ proposalId }) });
}
