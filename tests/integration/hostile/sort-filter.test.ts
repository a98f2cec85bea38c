import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { exportColumnKeys } from "@/lib/exports/tables/columns";
import { tableFormats } from "@/lib/exports/tables/formats";
import { targetTableExportRoutes, technicalSummaryRoutes } from "@/lib/server/api/export-routes";
import { targetCollectionRoutes } from "@/lib/server/api/target-routes";
import { createTarget, updateTarget } from "@/lib/server/targets";
import type { TargetView } from "@/lib/workspace/target-view";
import { targetListQuerySchema, targetSortColumns } from "@/lib/workspace/target-query";
import { answerOf, expectDocumentedAnswer, hostileText, type Answer } from "../support/hostile-input";
import { createWorld, pointTargetInput, type World } from "../support/world";

/**
 * The target list sorts and filters only on the columns the API documents (DEVELOPERS.md, the
 * table's query string); anything else is a 400 naming the parameter, never text passed to SQL.
 * Written out here from the API's documentation, and checked against the schema's own lists.
 */
const documentedSortColumns = ["name", "raDeg", "decDeg", "priority", "status", "einsteinRadiusMas", "imageSeparationMas", "magnificationTotal", "timeDelayDays", "crossingTimeDays", "timeRequestHours", "peakSignalToNoise", "caseVerdict", "updatedAt"];
const documentedFilters = {
  status: ["candidate", "accepted", "scheduled", "observed", "dropped"],
  lensModel: ["point", "sis"],
  caseVerdict: ["feasible", "marginal", "infeasible", "unknown"],
  answeredCase: ["photometric-microlensing", "astrometric-microlensing", "resolved-images", "time-delay", "horizon-scale", "relativistic-orbit"],
} as const;
const documentedExportColumns = [
  "name", "raDeg", "decDeg", "lensModel", "lensMassSolar", "velocityDispersionKmPerS", "lensDistancePc", "sourceDistancePc", "lensRedshift", "sourceRedshift", "sourceOffsetThetaE", "properMotionMasPerYr", "scienceCase", "eventPeakJdUtc", "sourceRadiusSolar", "sourceRadiusThetaE", "limbDarkeningU", "sourceMagnitude", "sourceBand", "blendFraction", "einsteinTimeDays", "parallaxNorth", "parallaxEast", "orbitSemiMajorAxisAu", "orbitSemiMajorAxisMas", "orbitEccentricity", "orbitPeriodDays", "orbitPeriapsisJdUtc", "orbitInclinationDeg", "orbitNodeDeg", "orbitPeriapsisArgumentDeg", "priority", "status", "tags",
  "einsteinRadiusMas", "imageSeparationMas", "magnificationTotal", "timeDelayDays", "crossingTimeDays", "shadowDiameterMicroarcsec", "timeRequestHours", "peakSignalToNoise", "answeredCase", "caseVerdict", "caseAnswers",
];

const runs = 60;
let world: World;

/** Targets whose sort columns differ, with nulls where a model gives no value (an SIS has no time delay here, no proper motion no crossing time). */
beforeAll(async () => {
  world = await createWorld();
  const ids = { proposalId: world.proposalId };
  const pi = world.actors.pi;
  const sis = { ...pointTargetInput, lensModel: "sis", lensMassSolar: null, lensDistancePc: null, sourceDistancePc: null, properMotionMasPerYr: null };
  await createTarget(ids, { ...pointTargetInput, name: "A-02", ra: "17 50 00", dec: "-28 00 00", lensMassSolar: 0.1, lensDistancePc: 2000, priority: 1, tags: ["disk"] }, pi);
  const b = await createTarget(ids, { ...pointTargetInput, name: "B-07", ra: "18 02 00", dec: "-30 10 00", lensMassSolar: 1.2, lensDistancePc: 6000, priority: 3, tags: ["bulge", "late"] }, pi);
  const c = await createTarget(ids, { ...sis, name: "C-11", ra: "10 00 00", dec: "+02 00 00", velocityDispersionKmPerS: 200, lensRedshift: 0.3, sourceRedshift: 1.5, priority: 5 }, pi);
  await createTarget(ids, { ...sis, name: "D-05", ra: "12 30 00", dec: "+12 00 00", velocityDispersionKmPerS: 250, lensRedshift: 0.5, sourceRedshift: 2, priority: 2, sourceOffsetThetaE: 0.8 }, pi);
  await updateTarget({ ...ids, targetId: b.id }, { status: "accepted" }, pi);
  await updateTarget({ ...ids, targetId: c.id }, { status: "dropped" }, pi);
});

afterAll(async () => {
  await dbClient().sql.end();
});

const url = (path: string, query: Record<string, string>) => `http://arcwright.test/api/proposals/${world.proposalId}${path}?${new URLSearchParams(query)}`;

async function listTargets(query: Record<string, string>): Promise<Answer> {
  const get = targetCollectionRoutes(async () => world.actors.pi).GET;
  return answerOf(await get(new Request(url("/targets", query)), { params: Promise.resolve({ proposalId: world.proposalId }) }));
}

/** A 400 in the documented shape whose fields are exactly `names`. */
function expectRefusalNaming(answer: Answer, names: string[]) {
  expectDocumentedAnswer(answer, { inputNames: names });
  expect(answer.status, JSON.stringify(answer.body)).toBe(400);
  expect(Object.keys((answer.body as { error: { fields: object } }).error.fields)).toEqual(names);
}

// PostgreSQL sorts an enum by its declared order (manual, "Enumerated Types"); this cluster's C.UTF-8
// collation sorts text by code point, which for these ASCII names is JavaScript's order too.
const enumOrder: Partial<Record<keyof TargetView, readonly string[]>> = { status: documentedFilters.status, caseVerdict: documentedFilters.caseVerdict };

function compareValues(column: keyof TargetView, a: unknown, b: unknown): number {
  const order = enumOrder[column];
  if (order) return order.indexOf(a as string) - order.indexOf(b as string);
  if (typeof a === "number" && typeof b === "number") return a - b;
  return String(a) < String(b) ? -1 : String(a) > String(b) ? 1 : 0;
}

describe("target list: sort and filter accept only the documented columns", () => {
  it("the documented sort columns and filter values are exactly the query schema's lists", () => {
    expect([...targetSortColumns]).toEqual(documentedSortColumns);
    const shape = targetListQuerySchema.shape;
    expect(shape.sort.unwrap().options).toEqual(documentedSortColumns);
    expect(shape.direction.unwrap().options).toEqual(["asc", "desc"]);
    expect(shape.status.unwrap().options).toEqual(documentedFilters.status);
    expect(shape.lensModel.unwrap().options).toEqual(documentedFilters.lensModel);
    expect(shape.caseVerdict.unwrap().options).toEqual(documentedFilters.caseVerdict);
    expect(shape.answeredCase.unwrap().options).toEqual(documentedFilters.answeredCase);
  });

  it("any other sort column is a 400 naming sort, whatever it looks like", async () => {
    const unknownColumn = fc.oneof(hostileText, fc.constantFrom("id", "proposalId", "createdBy", "name desc", "name; DROP TABLE targets", "NAME", "raDeg,name", "1", "random()", "__proto__", "constructor")).filter((c) => !documentedSortColumns.includes(c));
    await fc.assert(
      fc.asyncProperty(unknownColumn, async (sort) => expectRefusalNaming(await listTargets({ sort }), ["sort"])),
      { numRuns: runs },
    );
  });

  it("any other direction is a 400 naming direction", async () => {
    const direction = hostileText.filter((d) => d !== "asc" && d !== "desc");
    await fc.assert(fc.asyncProperty(direction, async (d) => expectRefusalNaming(await listTargets({ direction: d }), ["direction"])), { numRuns: runs });
  });

  for (const column of documentedSortColumns) {
    for (const direction of ["asc", "desc"]) {
      it(`sort=${column}&direction=${direction} answers 200 in that order, rows without a value last`, async () => {
        const answer = await listTargets({ sort: column, direction });
        expect(answer.status, JSON.stringify(answer.body)).toBe(200);
        const rows = (answer.body as { rows: TargetView[] }).rows;
        expect(rows.length).toBe(5);
        const values = rows.map((row) => row[column as keyof TargetView]);
        for (let i = 1; i < values.length; i++) {
          const [a, b] = [values[i - 1], values[i]];
          if (a === null) expect(b, `${column}: a value after a null`).toBeNull();
          else if (b !== null) expect(compareValues(column as keyof TargetView, a, b) * (direction === "asc" ? 1 : -1), `${column} ${direction}: ${a} before ${b}`).toBeLessThanOrEqual(0);
        }
      });
    }
  }

  for (const [filter, known] of Object.entries(documentedFilters)) {
    it(`${filter}: every documented value answers 200 with only matching rows; anything else is a 400 naming ${filter}`, async () => {
      for (const value of known) {
        const answer = await listTargets({ [filter]: value });
        expect(answer.status, JSON.stringify(answer.body)).toBe(200);
        for (const row of (answer.body as { rows: TargetView[] }).rows) expect(row[filter as keyof TargetView]).toBe(value);
      }
      const other = hostileText.filter((v) => !(known as readonly string[]).includes(v));
      await fc.assert(fc.asyncProperty(other, async (value) => expectRefusalNaming(await listTargets({ [filter]: value }), [filter])), { numRuns: runs / 2 });
    });
  }
});

describe("exports: columns, formats and figures accept only the documented names", () => {
  async function exportTable(query: Record<string, string>): Promise<Answer> {
    const get = targetTableExportRoutes(async () => world.actors.pi).GET;
    return answerOf(await get(new Request(url("/exports/targets", query)), { params: Promise.resolve({ proposalId: world.proposalId }) }));
  }

  it("the documented export columns are exactly the exporter's list", () => {
    expect([...exportColumnKeys]).toEqual(documentedExportColumns);
    expect([...tableFormats]).toEqual(["csv", "ecsv", "tex", "votable", "json"]);
  });

  it("a list of documented columns exports exactly those, in that order (RA and Dec with their sexagesimal forms); one unknown name makes it a 400 naming columns", async () => {
    const unknownColumn = fc.oneof(hostileText, fc.constantFrom("id", "createdBy", "passwordHash", "__proto__")).filter((c) => !documentedExportColumns.includes(c.trim()) && !c.includes(","));
    const request = fc.record({
      known: fc.shuffledSubarray(documentedExportColumns, { minLength: 1 }),
      unknown: fc.option(fc.tuple(unknownColumn, fc.nat()), { nil: undefined }),
    });
    await fc.assert(
      fc.asyncProperty(request, async ({ known, unknown }) => {
        const names = [...known];
        if (unknown) names.splice(unknown[1] % (names.length + 1), 0, unknown[0]);
        const answer = await exportTable({ format: "json", columns: names.join(",") });
        if (unknown) {
          expectRefusalNaming(answer, ["columns"]);
        } else {
          expect(answer.status, JSON.stringify(answer.body)).toBe(200);
          const table = answer.body as { columns: { key: string }[] };
          // RA and Dec are each followed by their sexagesimal form, in JSON as in every format.
          expect(table.columns.map((c) => c.key)).toEqual(names.flatMap((name) => [name, ...(name === "raDeg" ? ["raHms"] : name === "decDeg" ? ["decDms"] : [])]));
        }
      }),
      { numRuns: runs },
    );
  });

  it("any other table format is a 400 naming format", async () => {
    const format = hostileText.filter((f) => !(tableFormats as readonly string[]).includes(f));
    await fc.assert(fc.asyncProperty(format, async (f) => expectRefusalNaming(await exportTable({ format: f }), ["format"])), { numRuns: runs / 2 });
  });

  it("a summary asks only for the documented figures (season, night); anything else is a 400 naming figures", async () => {
    const get = technicalSummaryRoutes(async () => world.actors.pi).GET;
    const figure = hostileText.filter((f) => !["season", "night"].includes(f.trim()) && !f.includes(","));
    await fc.assert(
      fc.asyncProperty(figure, async (f) => {
        const answer = await answerOf(await get(new Request(url("/exports/summary", { figures: `season,${f}` })), { params: Promise.resolve({ proposalId: world.proposalId }) }));
        expectRefusalNaming(answer, ["figures"]);
      }),
      { numRuns: runs / 2 },
    );
  });
});
