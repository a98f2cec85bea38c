import { readFileSync } from "node:fs";
import { count, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { activity, imports, targets, uploadedFiles } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { toCsvField } from "@/lib/imports/formula";
import type { ColumnMapping } from "@/lib/imports/columns";
import { commitImport, previewImport } from "@/lib/server/imports";
import { updateProposal } from "@/lib/server/proposals";
import { demoCycle } from "@/db/seed/demo-sky-cycle";
import { createWorld, type World } from "./support/world";
import { startUploadService, type UploadService } from "./support/upload-service";

const { db, sql: connection } = dbClient();
let service: UploadService;

beforeAll(async () => {
  service = await startUploadService();
});

afterAll(async () => {
  await service.stop();
  await connection.end();
});

const encode = (text: string) => new TextEncoder().encode(text);

/** Row counts of every table an import may write, to prove a refusal wrote nothing. */
async function tableCounts(proposalId: string) {
  const [[t], [i], [a], [f]] = await Promise.all([
    db.select({ n: count() }).from(targets).where(eq(targets.proposalId, proposalId)),
    db.select({ n: count() }).from(imports).where(eq(imports.proposalId, proposalId)),
    db.select({ n: count() }).from(activity).where(eq(activity.proposalId, proposalId)),
    db.select({ n: count() }).from(uploadedFiles).where(eq(uploadedFiles.proposalId, proposalId)),
  ]);
  return { targets: t.n, imports: i.n, activity: a.n, files: f.n };
}

async function uploadList(world: World, name: string, text: string): Promise<string> {
  const attempt = await service.uploadAs(world.actors.coi, "targetList", { proposalId: world.proposalId }, { name, bytes: encode(text), type: "text/csv" });
  if (attempt.stage !== "stored" || !attempt.serverData.ok) throw new Error(`upload refused: ${JSON.stringify(attempt)}`);
  return attempt.serverData.fileId;
}

async function refusalOf(promise: Promise<unknown>): Promise<AppError> {
  const error = await promise.then(() => null, (e: unknown) => e);
  expect(error).toBeInstanceOf(AppError);
  return error as AppError;
}

// Point lenses: θ_E = sqrt(4GM/c² · (D_S − D_L)/(D_L D_S)). For 0.5 M☉, D_L = 4 kpc, D_S = 8 kpc:
// 4 · 1476.625 m · 0.5 / (3.0857e16 m · 8000) → 3.4588e-9 rad = 0.7134 mas (same check as tests/e2e/workspace.test.ts).
const threeTargets = [
  "name,ra,dec,mass [Msun],D_L [pc],D_S [pc],mu [mas/yr]",
  "IMP-0001,17:56:40.0,-29:30:00,0.5,4000,8000,5",
  "IMP-0002,17:58:01.0,-29:20:00,0.3,3000,8000,4",
  "IMP-0003,18:01:30.2,-28:55:10,0.8,5000,8000,6",
].join("\n");

describe("target-list import through the upload service", () => {
  it("previews the proposed mapping, commits in one go with computed columns, and a re-import adds nothing", async () => {
    const world = await createWorld();
    const fileId = await uploadList(world, "bulge candidates.csv", threeTargets);
    const params = { proposalId: world.proposalId };

    const preview = await previewImport(params, { fileId }, world.actors.coi);
    expect(preview.file.format).toBe("csv");
    expect(preview.mapping.name?.column).toBe(0);
    expect(preview.mapping.lensMassSolar).toEqual({ column: 3, unit: "Msun" });
    expect(preview.counts).toEqual({ added: 3, updated: 0, skipped: 0, invalid: 0 });
    expect(preview.rows.map((row) => row.action)).toEqual(["add", "add", "add"]);
    const before = await tableCounts(world.proposalId);

    const first = await commitImport(params, { fileId, mapping: preview.mapping, toleranceArcsec: 1 }, world.actors.coi);
    expect(first).toMatchObject({ added: 3, updated: 0, skipped: 0 });
    const after = await tableCounts(world.proposalId);
    expect(after).toEqual({ ...before, targets: before.targets + 3, imports: before.imports + 1, activity: before.activity + 1 });
    const [imported] = await db.select().from(targets).where(eq(targets.name, "IMP-0001"));
    expect(imported.einsteinRadiusMas).toBeCloseTo(0.7134, 4);
    expect(imported.lensModel).toBe("point");
    const [record] = await db.select().from(imports).where(eq(imports.id, first.importId));
    expect(record).toMatchObject({ fileId, format: "csv", addedCount: 3, updatedCount: 0, skippedCount: 0, toleranceArcsec: 1, importedBy: world.actors.coi.userId });
    const [entry] = await db.select().from(activity).where(eq(activity.proposalId, world.proposalId)).orderBy(sql`${activity.id} desc`).limit(1);
    expect(entry.subject).toBe("targets from bulge candidates.csv (3 added, 0 updated, 0 skipped)");

    // The same file again (uploaded anew): every row matches its target by name and is unchanged.
    const again = await uploadList(world, "bulge candidates.csv", threeTargets);
    const second = await commitImport(params, { fileId: again, mapping: preview.mapping, toleranceArcsec: 1 }, world.actors.coi);
    expect(second).toMatchObject({ added: 0, updated: 0, skipped: 3 });
    expect((await tableCounts(world.proposalId)).targets).toBe(after.targets);
  });

  it("matches by position within the tolerance the user chose, and updates only the mapped fields", async () => {
    const world = await createWorld();
    const params = { proposalId: world.proposalId };
    // The world's target TB-ML-0001 is at 17 57 12.4, −29 12 05 with 0.4 M☉; this row is 0.6″ north of it.
    const renamed = "name,ra,dec,mass,D_L,D_S\nBLG-17,17 57 12.4,-29 12 04.4,0.45,4000,8000\n";
    const fileId = await uploadList(world, "renamed.csv", renamed);
    const narrow = await previewImport(params, { fileId, toleranceArcsec: 0.5 }, world.actors.coi);
    expect(narrow.rows[0].action).toBe("add");
    const wide = await previewImport(params, { fileId, toleranceArcsec: 1 }, world.actors.coi);
    expect(wide.rows[0].action).toBe("update");
    expect(wide.rows[0].detail).toBe("updates TB-ML-0001 (0.60″ away)");
    // Typed as the wizard sends it, with the one quantity parser's units and comma rules (1″ = 1000 mas by definition).
    expect((await previewImport(params, { fileId, toleranceArcsec: "500 mas" }, world.actors.coi)).rows[0].action).toBe("add");
    expect((await previewImport(params, { fileId, toleranceArcsec: "0,7" }, world.actors.coi)).rows[0].action).toBe("update");
    await expect(previewImport(params, { fileId, toleranceArcsec: "1,000" }, world.actors.coi)).rejects.toMatchObject({
      fields: { toleranceArcsec: [expect.stringMatching(/^Position tolerance: '1,000' could be 1000 or 1\.000/)] },
    });

    const result = await commitImport(params, { fileId, mapping: wide.mapping, toleranceArcsec: 1 }, world.actors.coi);
    expect(result).toMatchObject({ added: 0, updated: 1, skipped: 0 });
    const [target] = await db.select().from(targets).where(eq(targets.id, world.targetId));
    // The name stays; mass changes; distances (not in the file) keep their values.
    expect(target).toMatchObject({ name: "TB-ML-0001", lensMassSolar: 0.45, lensDistancePc: 4000, sourceDistancePc: 8000, tags: ["bulge"] });
    // θ_E ∝ sqrt(M): 0.45 M☉ at 4/8 kpc is sqrt(0.45/0.5) × 0.7134 mas = 0.6768 mas.
    expect(target.einsteinRadiusMas).toBeCloseTo(0.6768, 4);
  });

  it("a file with one bad row is refused whole with the row named, and the database is as it was", async () => {
    const world = await createWorld();
    const bad = `${threeTargets}\nIMP-0004,18:02:00,+95:00:00,0.5,4000,8000,5\n`;
    const fileId = await uploadList(world, "one bad row.csv", bad);
    const params = { proposalId: world.proposalId };
    const preview = await previewImport(params, { fileId }, world.actors.coi);
    expect(preview.counts.invalid).toBe(1);
    expect(preview.rows[3].errors[0]).toMatch(/^row 4: Dec \+95:00:00 — /);
    const before = await tableCounts(world.proposalId);
    const error = await refusalOf(commitImport(params, { fileId, mapping: preview.mapping }, world.actors.coi));
    expect(error.code).toBe("bad_request:import");
    expect(error.message).toMatch(/^1 of 4 rows cannot be imported, so nothing was imported; fix them, or choose to import the other rows without them\. row 4: Dec/);
    expect(await tableCounts(world.proposalId)).toEqual(before);
  });

  it("a mapping the request cannot use is refused in words naming the field, not its key (issue #15)", async () => {
    const world = await createWorld();
    const fileId = await uploadList(world, "three.csv", threeTargets);
    const params = { proposalId: world.proposalId };
    const preview = await previewImport(params, { fileId }, world.actors.coi);
    const badColumn = await refusalOf(previewImport(params, { fileId, mapping: { ...preview.mapping, lensMassSolar: { column: "mass" } } }, world.actors.coi));
    expect(badColumn.fields).toEqual({ "mapping.lensMassSolar.column": ["The lens mass column: choose a column of the file."] });
    expect(badColumn.message).toBe("The lens mass column: choose a column of the file.");
    const withoutName = Object.fromEntries(Object.entries(preview.mapping).filter(([field]) => field !== "name"));
    const noName = await refusalOf(previewImport(params, { fileId, mapping: withoutName }, world.actors.coi));
    expect(noName.message).toBe("Choose the column that holds the Name.");
    const badFill = await refusalOf(previewImport(params, { fileId, fill: { priority: "first" } }, world.actors.coi));
    expect(badFill.message).toMatch(/^Priority: 'first' is not a (?:plain )?number; type a number, e\.g\. 3\.$/);
  });

  it("a failure in the database after hundreds of rows were written leaves nothing behind", async () => {
    const world = await createWorld();
    const lines = ["name,ra,dec,mass,D_L,D_S"];
    for (let i = 1; i <= 1000; i += 1) lines.push(`ROLL-${String(i).padStart(4, "0")},${(i * 0.3) % 360},${-60 + i * 0.1},0.5,4000,8000`);
    const fileId = await uploadList(world, "thousand.csv", lines.join("\n"));
    const params = { proposalId: world.proposalId };
    const { mapping } = await previewImport(params, { fileId }, world.actors.coi);
    const before = await tableCounts(world.proposalId);
    // A trigger refuses the 900th row: rows 1–500 are already inserted by then, in the same transaction.
    await connection.unsafe(`
      create or replace function refuse_roll_0900() returns trigger language plpgsql as $$
      begin if new.name = 'ROLL-0900' then raise exception 'refused by the test trigger'; end if; return new; end $$;
      create trigger refuse_roll_0900 before insert on targets for each row execute function refuse_roll_0900();`);
    try {
      const failure = await commitImport(params, { fileId, mapping }, world.actors.coi).then(() => null, (e: unknown) => e as Error);
      expect(String((failure?.cause as Error | undefined)?.message)).toMatch(/refused by the test trigger/);
    } finally {
      await connection.unsafe("drop trigger refuse_roll_0900 on targets; drop function refuse_roll_0900();");
    }
    expect(await tableCounts(world.proposalId)).toEqual(before);
  });

  it("imports 1,000 rows from CSV and from VOTable (time printed, not asserted)", async () => {
    const world = await createWorld();
    const params = { proposalId: world.proposalId };
    const csv = ["name,ra,dec,mass,D_L,D_S"];
    const tr: string[] = [];
    for (let i = 1; i <= 1000; i += 1) {
      csv.push(`CSV-${i},${(i * 0.31) % 360},${-70 + i * 0.13},0.5,4000,8000`);
      tr.push(`<TR><TD>VOT-${i}</TD><TD>${(i * 0.29) % 360}</TD><TD>${-70 + i * 0.12}</TD><TD>0.6</TD><TD>4</TD><TD>8</TD></TR>`);
    }
    // IVOA VOTable 1.4: FIELDs with unit and ucd, TABLEDATA rows.
    const votable = `<?xml version="1.0"?><VOTABLE version="1.4" xmlns="http://www.ivoa.net/xml/VOTable/v1.3"><RESOURCE><TABLE>
      <FIELD name="name" datatype="char" arraysize="*" ucd="meta.id;meta.main"/><FIELD name="RAJ2000" datatype="double" unit="deg" ucd="pos.eq.ra;meta.main"/>
      <FIELD name="DEJ2000" datatype="double" unit="deg" ucd="pos.eq.dec;meta.main"/><FIELD name="mass" datatype="double" unit="solMass"/>
      <FIELD name="D_L" datatype="double" unit="kpc"/><FIELD name="D_S" datatype="double" unit="kpc"/>
      <DATA><TABLEDATA>${tr.join("")}</TABLEDATA></DATA></TABLE></RESOURCE></VOTABLE>`;
    for (const [name, text] of [["thousand.csv", csv.join("\n")], ["thousand.vot", votable]] as const) {
      const fileId = await uploadList(world, name, text);
      const started = performance.now();
      const preview = await previewImport(params, { fileId }, world.actors.coi);
      const previewed = performance.now();
      const result = await commitImport(params, { fileId, mapping: preview.mapping }, world.actors.coi);
      const committed = performance.now();
      expect(preview.counts.invalid).toBe(0);
      expect(result.added).toBe(1000);
      console.log(`import of 1,000 rows from ${preview.file.format}: preview ${(previewed - started).toFixed(0)} ms, commit ${(committed - previewed).toFixed(0)} ms`);
    }
    const [kpcRow] = await db.select().from(targets).where(eq(targets.name, "VOT-1"));
    // VOTable unit="kpc": 4 kpc is 4000 pc.
    expect(kpcRow.lensDistancePc).toBe(4000);
  });
});

describe("bad target-list files are refused at upload with a message, and nothing is recorded", () => {
  const bomb = `<?xml version="1.0"?><!DOCTYPE lolz [<!ENTITY lol "lol"><!ENTITY lol2 "&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;">]><VOTABLE><RESOURCE><TABLE><FIELD name="name"/><DATA><TABLEDATA><TR><TD>&lol2;</TD></TR></TABLEDATA></DATA></TABLE></RESOURCE></VOTABLE>`;
  const cases: [string, Uint8Array, RegExp][] = [
    ["a PNG image", new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0xff, 0xfe, 0x00, 0x81]), /not UTF-8 text/],
    ["malformed CSV", encode('name,ra,dec\n"IMP-1,17:57:12,-29:12:05\n'), /The CSV is malformed\..*never closed/],
    ["malformed XML", encode("<VOTABLE><RESOURCE><TABLE></RESOURCE></VOTABLE>"), /The XML is malformed at line 1/],
    ["an XML bomb", encode(bomb), /declares a DOCTYPE or entities/],
    ["only headers", encode("name,ra,dec\n"), /a header row but no data rows/],
    ["blank text", encode("  \n\n"), /The file is empty/],
  ];
  for (const [what, bytes, message] of cases) {
    it(`${what}: refused, the stored file deleted, no row written`, async () => {
      const world = await createWorld();
      const before = await tableCounts(world.proposalId);
      const attempt = await service.uploadAs(world.actors.coi, "targetList", { proposalId: world.proposalId }, { name: "list.csv", bytes, type: "text/csv" });
      expect(attempt.stage).toBe("stored");
      if (attempt.stage !== "stored" || attempt.serverData.ok) throw new Error("expected a refusal");
      expect(attempt.serverData.message).toMatch(message);
      expect(await service.isStored(attempt.key, 3_000)).toBe(false);
      expect(await tableCounts(world.proposalId)).toEqual(before);
    });
  }

  it("an empty or oversize file is refused before any URL is signed", async () => {
    const world = await createWorld();
    const input = { proposalId: world.proposalId };
    const empty = await service.uploadAs(world.actors.coi, "targetList", input, { name: "empty.csv", bytes: new Uint8Array(0) });
    expect(empty).toEqual({ stage: "presign", status: 400, message: "The file is empty." });
    const big = await service.uploadAs(world.actors.coi, "targetList", input, { name: "big.csv", bytes: encode("x"), declaredSize: 6 * 1024 * 1024 });
    expect(big).toEqual({ stage: "presign", status: 413, message: "The file is larger than 5 MB, the limit for a target list." });
  });

  it("formula-like cells are stored as written and neutralized on export", async () => {
    const world = await createWorld();
    const fileId = await uploadList(world, "formula.csv", 'name,ra,dec,mass,D_L,D_S\n"=HYPERLINK(""http://x.invalid"")",10,-20,0.5,4000,8000\n@SUM(A1),11,-21,0.5,4000,8000\n');
    const params = { proposalId: world.proposalId };
    const { mapping } = await previewImport(params, { fileId }, world.actors.coi);
    expect(await commitImport(params, { fileId, mapping }, world.actors.coi)).toMatchObject({ added: 2 });
    const names = (await db.select({ name: targets.name }).from(targets).where(eq(targets.proposalId, world.proposalId))).map((r) => r.name).sort();
    expect(names).toContain('=HYPERLINK("http://x.invalid")');
    expect(names).toContain("@SUM(A1)");
    // OWASP CSV injection: a leading apostrophe makes spreadsheets show the text instead of running it.
    expect(toCsvField('=HYPERLINK("http://x.invalid")')).toBe(`"'=HYPERLINK(""http://x.invalid"")"`);
  });
});

describe("who may upload and import", () => {
  it("the upload middleware refuses signed out (401), a non-member (404) and a viewer (403) before signing a URL", async () => {
    const world = await createWorld();
    const before = await tableCounts(world.proposalId);
    const file = { name: "list.csv", bytes: encode(threeTargets) };
    const input = { proposalId: world.proposalId };
    expect(await service.uploadAs(null, "targetList", input, file)).toEqual({ stage: "presign", status: 401, message: "Sign in to continue." });
    expect(await service.uploadAs(world.actors.outsider, "targetList", input, file)).toEqual({ stage: "presign", status: 404, message: "No such proposal." });
    expect(await service.uploadAs(world.actors.viewer, "targetList", input, file)).toMatchObject({ stage: "presign", status: 403 });
    expect(await service.uploadAs(world.actors.coi, "targetList", { proposalId: "not-a-uuid" }, file)).toMatchObject({ stage: "presign", status: 404 });
    expect(await tableCounts(world.proposalId)).toEqual(before);
  });

  it("the import endpoints refuse a viewer (403) and a non-member (404) even with a real file id", async () => {
    const world = await createWorld();
    const fileId = await uploadList(world, "list.csv", threeTargets);
    const params = { proposalId: world.proposalId };
    const mapping: ColumnMapping = { name: { column: 0 }, ra: { column: 1 }, dec: { column: 2 } };
    expect((await refusalOf(previewImport(params, { fileId }, world.actors.viewer))).code).toBe("forbidden:import");
    expect((await refusalOf(commitImport(params, { fileId, mapping }, world.actors.viewer))).code).toBe("forbidden:import");
    expect((await refusalOf(commitImport(params, { fileId, mapping }, world.actors.outsider))).code).toBe("not_found:proposal");
    // A file of another proposal is not found from this one.
    const other = await createWorld();
    expect((await refusalOf(previewImport({ proposalId: other.proposalId }, { fileId }, other.actors.coi))).code).toBe("not_found:file");
  });
});

describe("the source's photometry through an import (magnitude, band, f_s)", () => {
  // An event at the bulge peaking mid-cycle, a 2 m telescope observing in I: a budget to keep.
  const eventList = (extra: string, cells: string) =>
    [`name,ra,dec,mass [Msun],D_L [pc],D_S [pc],mu [mas/yr],u0,t0,priority${extra}`, `PB-0001,17:56:40.0,-29:30:00,0.5,4000,8000,5,0.1,2031-06-11 04:00,${cells}`].join("\n");

  it("stores the magnitude, the band read from its label and f_s, and an update from a file without them keeps them and the time request they give", async () => {
    const world = await createWorld();
    const params = { proposalId: world.proposalId };
    await updateProposal(params, { ...demoCycle, photometry: { apertureM: 2, bandId: "jc-i" } }, world.actors.pi);
    const first = await uploadList(world, "events.csv", eventList(",I_s,band,f_s", "1,17.5,i (SDSS),0.7"));
    const preview = await previewImport(params, { fileId: first }, world.actors.coi);
    expect(preview.mapping).toMatchObject({ sourceMagnitude: { column: 10, unit: "mag", isUnitAssumed: true }, sourceBand: { column: 11 }, blendFraction: { column: 12 } });
    await commitImport(params, { fileId: first, mapping: preview.mapping, toleranceArcsec: 1 }, world.actors.coi);
    const [added] = await db.select().from(targets).where(eq(targets.name, "PB-0001"));
    expect(added).toMatchObject({ sourceMagnitude: 17.5, sourceBand: "sdss-i", blendFraction: 0.7 });
    expect(added.timeRequestHours).toBeGreaterThan(0);

    // A file that changes only the priority: the update must derive from the stored source, not drop it.
    const second = await uploadList(world, "priorities.csv", eventList("", "3"));
    const update = await previewImport(params, { fileId: second }, world.actors.coi);
    expect(update.counts).toMatchObject({ updated: 1, invalid: 0 });
    await commitImport(params, { fileId: second, mapping: update.mapping, toleranceArcsec: 1 }, world.actors.coi);
    const [updated] = await db.select().from(targets).where(eq(targets.name, "PB-0001"));
    expect(updated).toMatchObject({ priority: 3, sourceMagnitude: 17.5, sourceBand: "sdss-i", blendFraction: 0.7 });
    expect(updated.timeRequestHours).toBe(added.timeRequestHours);
    expect(updated.peakSignalToNoise).toBe(added.peakSignalToNoise);
  });

  it("refuses a row whose band is none of ours, naming the row, the field and the column, and writes nothing", async () => {
    const world = await createWorld();
    const params = { proposalId: world.proposalId };
    const fileId = await uploadList(world, "events.csv", eventList(",I_s,filter", "1,17.5,Gaia G"));
    const preview = await previewImport(params, { fileId }, world.actors.coi);
    expect(preview.rows[0].errors[0]).toMatch(/^row 1: Source band Gaia G \(column "filter"\) is not a band we know: write a band id such as jc-i/);
    const before = await tableCounts(world.proposalId);
    const refusal = await refusalOf(commitImport(params, { fileId, mapping: preview.mapping, toleranceArcsec: 1 }, world.actors.coi));
    expect(refusal.code).toBe("bad_request:import");
    expect(await tableCounts(world.proposalId)).toEqual(before);
  });
});

describe("target lists written by astropy and STILTS (tests/fixtures/generate_import_tables.py)", () => {
  it("a BINARY2 VOTable from astropy and a BINARY one from STILTS upload, preview and commit every row; the second re-import changes nothing", async () => {
    const world = await createWorld();
    const params = { proposalId: world.proposalId };
    const fixture = (file: string) => readFileSync(`tests/fixtures/import-tables/${file}`, "utf8");
    const first = await uploadList(world, "astropy-binary2.vot", fixture("astropy-binary2.vot"));
    const preview = await previewImport(params, { fileId: first }, world.actors.coi);
    expect(preview.file.format).toBe("votable");
    expect(preview.counts).toEqual({ added: 4, updated: 0, skipped: 0, invalid: 0 });
    await commitImport(params, { fileId: first, mapping: preview.mapping, toleranceArcsec: 1 }, world.actors.coi);
    const [galaxy] = await db.select().from(targets).where(eq(targets.name, "HE 0435\u22121223 \u03a9"));
    // 250.5 km/s as astropy wrote it, 1.2 kpc (a float32) read as 1200 pc.
    expect(galaxy).toMatchObject({ lensModel: "sis", velocityDispersionKmPerS: 250.5, lensDistancePc: 1200, priority: 4 });

    // The same table as STILTS writes it (BINARY, its own FIELDs): every target matches and is unchanged.
    const second = await uploadList(world, "stilts-binary.vot", fixture("stilts-binary.vot"));
    const again = await previewImport(params, { fileId: second }, world.actors.coi);
    expect(again.counts).toEqual({ added: 0, updated: 0, skipped: 4, invalid: 0 });
  });
});
