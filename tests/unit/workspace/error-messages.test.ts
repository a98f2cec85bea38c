import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { AppError } from "@/lib/errors";
import { parseOrThrow } from "@/lib/server/http";
import * as auth from "@/lib/auth/schemas";
import * as astro from "@/lib/astro/inputs";
import * as schedule from "@/lib/schedule/request";
import { figureFormatQuerySchema } from "@/lib/exports/figures/figure-format";
import { seasonWindowQuerySchema } from "@/lib/figures/season-view";
import { exportColumnKeys, tableColumnsQuerySchema } from "@/lib/exports/tables/columns";
import { tableWriteOptionsSchema } from "@/lib/exports/tables/formats";
import * as importRequest from "@/lib/imports/request";
import * as photometryRequest from "@/lib/event-photometry/request";
import { parseCsvTable } from "@/lib/imports/csv";
import { proposeColumnMapping } from "@/lib/imports/columns";
import { validateImportRows } from "@/lib/imports/rows";
import * as admin from "@/lib/workspace/admin-schema";
import * as ids from "@/lib/workspace/ids";
import * as members from "@/lib/workspace/member-schema";
import * as notes from "@/lib/workspace/note-schema";
import * as proposals from "@/lib/workspace/proposal-schema";
import * as photometry from "@/lib/workspace/photometry-schema";
import * as targetQuery from "@/lib/workspace/target-query";
import * as targets from "@/lib/workspace/target-schema";
import * as fitRevision from "@/lib/workspace/fit-revision";

/**
 * Walks every zod schema of the product that reads user input with wrong types, missing fields,
 * out-of-range numbers, bad choices and malformed text, through the path the product parses it by
 * (`parseOrThrow` for request bodies, queries and params; the import's row reader), and holds every
 * message to the product rule: in the user's words, naming the field, with no key, schema path or
 * library message (issue #15: "Invalid input: expected number, received string … check
 * lensMassSolar" and "check tags.1, tags.2" reached users).
 */

/** What a message may never contain: a camelCase key, a dotted path with an index, zod's own words. */
const leaks: [string, RegExp][] = [
  ["a camelCase key", /\b[a-z]+[A-Z][A-Za-z]*\b/],
  ["a dotted path", /\b[A-Za-z_]\w*\.(?:\d+|[a-z]+[A-Z]\w*)\b/],
  ["zod's 'Invalid input'", /Invalid input/i],
  ["zod's 'expected'", /\bexpected\b/i],
  ["zod's 'received'", /\breceived\b/i],
  ["NaN", /\bNaN\b/],
  ["undefined", /\bundefined\b/],
  ["an object's text", /\[object /],
];

/**
 * The words that name each field (by its key, the last name in the path). A message must contain
 * one of them: a message beside its field still says what it is about when read alone (a summary,
 * a screen reader, an API client).
 */
const fieldWords: Record<string, RegExp> = {
  _: /request|site|instrument|mapping|column|values for empty cells/i,
  start: /date|night/i,
  nights: /night/i,
  name: /name|target|site/i,
  ra: /right ascension/i,
  dec: /declination/i,
  lensModel: /lens model/i,
  lensMassSolar: /lens mass/i,
  velocityDispersionKmPerS: /velocity dispersion/i,
  lensDistancePc: /lens distance/i,
  sourceDistancePc: /source distance/i,
  lensRedshift: /lens redshift/i,
  sourceRedshift: /source redshift/i,
  sourceOffsetThetaE: /source offset/i,
  properMotionMasPerYr: /proper motion/i,
  scienceCase: /science case/i,
  eventPeakJdUtc: /event peak/i,
  sourceRadiusSolar: /source radius/i,
  sourceRadiusThetaE: /source radius|ρ/i,
  limbDarkeningU: /limb.darkening/i,
  sourceMagnitude: /source magnitude/i,
  noteColumn: /notes column/i,
  leaveOutRefusedRows: /refused rows/i,
  fit: /LaTeX table layout/i,
  sourceBand: /band/i,
  blendFraction: /blend fraction/i,
  einsteinTimeDays: /Einstein time/i,
  parallaxNorth: /parallax/i,
  parallaxEast: /parallax/i,
  t0JdUtc: /peak time t0/i,
  u0: /impact parameter u0/i,
  rho: /source radius ρ/i,
  summary: /fit summary/i,
  chi2: /χ²/,
  dof: /degrees of freedom/i,
  pointCount: /number of points/i,
  referenceDataset: /reference dataset/i,
  datasets: /dataset/i,
  sigmas: /1σ errors/i,
  errorScales: /error scale factors/i,
  revisionId: /revision/i,
  photometry: /photometry/i,
  apertureM: /telescope aperture/i,
  centralObstructionM: /central obstruction/i,
  throughput: /throughput/i,
  readNoiseElectrons: /read noise/i,
  darkElectronsPerSPerPixel: /dark current/i,
  gainElectronsPerAdu: /gain/i,
  fullWellElectrons: /full well/i,
  pixelScaleArcsec: /pixel scale/i,
  seeingFwhmArcsec: /seeing/i,
  apertureRadiusFwhm: /aperture radius/i,
  psfShape: /PSF/,
  overheadS: /overhead/i,
  signalToNoiseGoal: /signal-to-noise/i,
  bandId: /band/i,
  customBand: /band/i,
  skyByBand: /band|site values/i,
  darkSkyMagPerArcsec2: /dark.sky/i,
  extinctionMagPerAirmass: /extinction/i,
  label: /band name/i,
  effectiveWavelengthNm: /wavelength/i,
  widthNm: /band width/i,
  zeroPointWPerM2PerNm: /zero point/i,
  zeroPointSystem: /magnitude system/i,
  abMinusVegaMag: /AB − Vega/i,
  moonMinSeparationDeg: /moon separation/i,
  moonMaxIllumination: /moon illumination/i,
  visitMinutes: /time per visit/i,
  clearNightFraction: /clear.night/i,
  astrometricPrecisionMas: /astrometric precision/i,
  reachableContrast: /reachable contrast/i,
  spectroscopicPrecisionKmPerS: /spectroscopic precision/i,
  orbitSemiMajorAxisAu: /semi-major axis/i,
  orbitSemiMajorAxisMas: /semi-major axis/i,
  orbitEccentricity: /eccentricity/i,
  orbitPeriodDays: /orbital period/i,
  orbitPeriapsisJdUtc: /time of periapsis/i,
  orbitInclinationDeg: /inclination/i,
  orbitNodeDeg: /ascending node/i,
  orbitPeriapsisArgumentDeg: /argument of periapsis/i,
  priority: /priority/i,
  status: /status/i,
  tags: /tag/i,
  title: /title/i,
  cycle: /cycle/i,
  abstract: /abstract/i,
  cycleStartDate: /first night|date/i,
  cycleEndDate: /last night|date/i,
  site: /site/i,
  instrument: /instrument/i,
  latitudeDeg: /latitude/i,
  longitudeDeg: /longitude/i,
  longitudeEastDeg: /longitude/i,
  elevationM: /elevation/i,
  horizonLimitDeg: /horizon/i,
  resolutionMas: /resolution/i,
  cadenceHours: /cadence/i,
  campaignLengthDays: /campaign/i,
  airmassLimit: /airmass/i,
  interferometerWavelengthMm: /wavelength/i,
  interferometerBaselineKm: /baseline/i,
  email: /e-mail/i,
  password: /password/i,
  callbackUrl: /return address/i,
  token: /link/i,
  role: /role/i,
  siteRole: /site role/i,
  userId: /account|member/i,
  proposalId: /proposal/i,
  targetId: /target/i,
  noteId: /note/i,
  invitationId: /invitation/i,
  body: /note/i,
  version: /version/i,
  q: /search/i,
  tag: /tag/i,
  page: /page/i,
  pageSize: /page size/i,
  sort: /sort/i,
  direction: /sort direction/i,
  caseVerdict: /case verdict/i,
  answeredCase: /science case/i,
  limit: /number of entries/i,
  before: /starting entry/i,
  format: /format/i,
  width: /width/i,
  dpi: /DPI/,
  columns: /column/i,
  digits: /digit/i,
  fileId: /file/i,
  mapping: /column mapping|column/i,
  column: /column/i,
  unit: /unit/i,
  isUnitAssumed: /unit/i,
  fill: /empty cells/i,
  toleranceArcsec: /position tolerance/i,
  raDeg: /right ascension/i,
  decDeg: /declination/i,
  safeSunElongationDeg: /sun elongation/i,
  stepMinutes: /time step/i,
  cycleStartNightIso: /first night|date/i,
  cycleEndNightIso: /last night|cycle|date/i,
  moon: /Moon/,
  minSeparationDeg: /Moon separation/i,
  maxIlluminatedFraction: /Moon illumination/i,
  timeColumn: /time column/i,
  timeKind: /time column's kind/i,
  timeOffsetDays: /time column's offset/i,
  timeScale: /time scale/i,
  brightnessKind: /magnitudes or fluxes/i,
  valueColumn: /magnitude or flux column/i,
  errorColumn: /error column/i,
  bandColumn: /band column/i,
  band: /band/i,
  datasetColumn: /dataset column/i,
  datasetName: /dataset name/i,
};

/**
 * The export's column names are the documented vocabulary of its `columns` query parameter (what an
 * API client types), so a refusal may list them; they are taken out before the leak check.
 */
function withoutExportColumnNames(message: string): string {
  return exportColumnKeys.reduce((text, key) => text.replaceAll(key, "column"), message);
}

function checkLeaks(message: string, where: string): void {
  for (const [what, pattern] of leaks) expect(withoutExportColumnNames(message), `${where}: ${what} in "${message}"`).not.toMatch(pattern);
}

function checkMessage(message: string, path: readonly PropertyKey[], where: string): void {
  checkLeaks(message, where);
  const key = [...path].reverse().find((segment): segment is string => typeof segment === "string" && !/^\d+$/.test(segment)) ?? "_";
  const words = fieldWords[key];
  expect(words, `${where}: no words known for the field ${key} ("${message}")`).toBeDefined();
  expect(message, `${where}: "${message}" does not name the field ${key}`).toMatch(words!);
}

const badScalars: unknown[] = [undefined, null, true, 0, -1, 3.5, -1e9, 1e30, Number.MAX_VALUE, "", " ", "zz", "5 kpc", "8,125", "a b!", "x".repeat(300), {}, [], ["a b!", 3], Array(20).fill("x")];
const badWholes: unknown[] = [undefined, null, 42, "text", [], true];

/** Every shape of a schema (nested objects too) as [path, keys]. */
function shapesOf(schema: z.ZodType, path: string[] = []): [string[], string[]][] {
  let current: unknown = schema;
  // Look through wrappers (default, optional, nullable, pipe, refine) to the object inside.
  for (let depth = 0; depth < 8 && current; depth++) {
    const def = (current as { def?: { type?: string; innerType?: unknown; in?: unknown; schema?: unknown } }).def;
    if (def?.type === "object") break;
    current = def?.innerType ?? def?.in ?? def?.schema;
  }
  const shape = (current as { shape?: Record<string, z.ZodType> } | undefined)?.shape;
  if (!shape) return [];
  return [[path, Object.keys(shape)], ...Object.entries(shape).flatMap(([key, inner]) => shapesOf(inner, [...path, key]))];
}

function at(path: string[], key: string, value: unknown): Record<string, unknown> {
  const leaf: Record<string, unknown> = value === undefined ? {} : { [key]: value };
  return path.reduceRight<Record<string, unknown>>((inner, segment) => ({ [segment]: inner }), leaf);
}

/** Each bad input for a schema: bad wholes, and every key of every shape set to every bad value. */
function badInputsOf(schema: z.ZodType): unknown[] {
  const inputs = [...badWholes];
  for (const [path, keys] of shapesOf(schema)) for (const key of keys) for (const value of badScalars) inputs.push(at(path, key, value));
  return inputs;
}

/** Schemas parsed by `parseOrThrow` (request bodies, query strings, route params). */
const parsedByParseOrThrow: Record<string, z.ZodType> = {
  targetFieldsSchema: targets.targetFieldsSchema,
  createTargetSchema: targets.createTargetSchema,
  updateTargetSchema: targets.updateTargetSchema,
  lensHypothesisSchema: targets.lensHypothesisSchema,
  siteSchema: proposals.siteSchema,
  instrumentSchema: proposals.instrumentSchema,
  createProposalSchema: proposals.createProposalSchema,
  updateProposalSchema: proposals.updateProposalSchema,
  photometrySettingsSchema: photometry.photometrySettingsSchema,
  membershipSchema: members.membershipSchema,
  changeRoleSchema: members.changeRoleSchema,
  createInvitationSchema: members.createInvitationSchema,
  acceptInvitationSchema: members.acceptInvitationSchema,
  noteSchema: notes.noteSchema,
  createNoteSchema: notes.createNoteSchema,
  updateNoteSchema: notes.updateNoteSchema,
  accountParamsSchema: admin.accountParamsSchema,
  accountListQuerySchema: admin.accountListQuerySchema,
  changeSiteRoleSchema: admin.changeSiteRoleSchema,
  proposalParamsSchema: ids.proposalParamsSchema,
  targetParamsSchema: ids.targetParamsSchema,
  noteParamsSchema: ids.noteParamsSchema,
  memberParamsSchema: ids.memberParamsSchema,
  invitationParamsSchema: ids.invitationParamsSchema,
  targetListQuerySchema: targetQuery.targetListQuerySchema,
  cursorQuerySchema: targetQuery.cursorQuerySchema,
  accountSchema: auth.accountSchema,
  signUpSchema: auth.signUpSchema,
  signInSchema: auth.signInSchema,
  emailOnlySchema: auth.emailOnlySchema,
  resetPasswordSchema: auth.resetPasswordSchema,
  linkSignInSchema: auth.linkSignInSchema,
  importFillSchema: importRequest.importFillSchema,
  importPreviewSchema: importRequest.importPreviewSchema,
  importCommitSchema: importRequest.importCommitSchema,
  photometryPreviewSchema: photometryRequest.photometryPreviewSchema,
  photometryCommitSchema: photometryRequest.photometryCommitSchema,
  figureFormatQuerySchema,
  seasonWindowQuerySchema,
  tableColumnsQuerySchema,
  tableWriteOptionsSchema,
  applyFitRequestSchema: fitRevision.applyFitRequestSchema,
  fitSummarySchema: fitRevision.fitSummarySchema,
  revisionParamsSchema: fitRevision.revisionParamsSchema,
};

describe("every schema's refusals are in the user's words and name the field", () => {
  it.each(Object.entries(parsedByParseOrThrow))("%s", (_, schema) => {
    let refusals = 0;
    for (const input of badInputsOf(schema)) {
      try {
        parseOrThrow(schema, input, "request");
      } catch (error) {
        if (!(error instanceof AppError)) throw error;
        refusals += 1;
        const where = JSON.stringify(input)?.slice(0, 120) ?? String(input);
        checkLeaks(error.message, `${where} (the summary)`);
        expect(Object.keys(error.fields ?? {}).length, where).toBeGreaterThan(0);
        for (const [key, messages] of Object.entries(error.fields ?? {})) {
          for (const message of messages) checkMessage(message, key === "_" ? [] : key.split("."), where);
        }
      }
    }
    expect(refusals).toBeGreaterThan(0);
  });

  it("the column mapping of an import: unknown fields, columns that are not numbers, units that are not text", () => {
    const bad = [{ lensMassSolar: { column: "two" } }, { lensMassSolar: { column: -1 } }, { lensMassSolar: { column: 1, unit: 5 } }, { lensMassSolar: { column: 1, unit: "" } }, { mass: { column: 1 } }, { ra: null }, "ra=1"];
    for (const mapping of bad) {
      try {
        parseOrThrow(importRequest.importPreviewSchema, { fileId: "9b2f7c7e-4d0a-4e8e-9a52-3f1f6d1c2b3a", mapping }, "import");
        expect.unreachable(JSON.stringify(mapping));
      } catch (error) {
        if (!(error instanceof AppError)) throw error;
        for (const [key, messages] of Object.entries(error.fields ?? {})) {
          for (const message of messages) {
            for (const [what, pattern] of leaks) expect(message, `${JSON.stringify(mapping)}: ${what}`).not.toMatch(pattern);
            // A mapping message names the field whose column is wrong ("The lens mass column: …") or the mapping.
            expect(message, key).toMatch(/lens mass column|column mapping|RA column/i);
          }
        }
      }
    }
  });

  it("the rows of an import name the row and the field, with the file's cell", () => {
    const table = parseCsvTable("name,ra,dec,mass,D_L,D_S,u0,priority,tags\nT1,10,10,5 kpc,4000,8000,0.3,9,a\nT2,10,10,0.5,4000,8000,x,2,b\nT3,10,10,0.5,8,125 pc,8000,0.3,2,c");
    const { rows } = validateImportRows(table, proposeColumnMapping(table.columns));
    const errors = rows.flatMap((row) => row.errors);
    expect(errors.length).toBeGreaterThanOrEqual(3);
    for (const error of errors) {
      expect(error).toMatch(/^row \d+: /);
      for (const [what, pattern] of leaks) expect(error, `${what} in "${error}"`).not.toMatch(pattern);
    }
  });
});

describe("the sky inputs, parsed outside parseOrThrow, word their own refusals", () => {
  // The sky page reads numbers from its query string (always text, turned into numbers or NaN), so
  // these schemas meet numbers, NaN and text, never other JSON types.
  const values = [Number.NaN, -1e9, 1e9, 3.5, "2031-02-30", "x"];
  it.each([
    ["skySiteSchema", astro.skySiteSchema],
    ["skyTargetSchema", astro.skyTargetSchema],
    ["skyLimitsSchema", astro.skyLimitsSchema],
    ["scheduleConstraintsSchema", schedule.scheduleConstraintsSchema],
    ["moonConstraintSchema", schedule.moonConstraintSchema],
  ] as const)("%s", (_, schema) => {
    for (const [path, keys] of shapesOf(schema)) {
      for (const key of keys) {
        for (const value of values) {
          if (key === "name" && typeof value !== "string") continue;
          const result = schema.safeParse(at(path, key, value));
          for (const issue of result.error?.issues ?? []) checkMessage(issue.message, issue.path, `${key}=${String(value)}`);
        }
      }
    }
  });
});

/**
 * The walk above is complete: every file of lib/ and app/ that builds a zod object is either walked
 * (its schemas exported and listed above) or says here why its schemas never word a refusal for a
 * user, or that it parses them only through parseOrThrow (whose error map words what they leave).
 */
describe("the walk covers every schema of the product", () => {
  const walked = new Set([
    "lib/workspace/target-schema.ts",
    "lib/workspace/fit-revision.ts",
    "lib/workspace/proposal-schema.ts",
    "lib/workspace/photometry-schema.ts",
    "lib/workspace/member-schema.ts",
    "lib/workspace/note-schema.ts",
    "lib/workspace/admin-schema.ts",
    "lib/workspace/ids.ts",
    "lib/workspace/target-query.ts",
    "lib/auth/schemas.ts",
    "lib/imports/request.ts",
    "lib/event-photometry/request.ts",
    "lib/exports/figures/figure-format.ts",
    "lib/figures/season-view.ts",
    "lib/exports/tables/columns.ts",
    "lib/exports/tables/formats.ts",
    "lib/astro/inputs.ts",
    "lib/schedule/request.ts",
  ]);
  const onlyThroughParseOrThrow = new Set([
    "lib/server/api/figure-routes.ts",
    "lib/server/exports/sky-figures.ts",
    "lib/server/exports/event-fit-figure.ts",
    "lib/server/exports/summary.ts",
    "lib/server/exports/target-table.ts",
    "lib/server/exports/calendar.ts",
    "lib/citations/bibtex-route.ts",
    "lib/server/imports.ts",
  ]);
  const neverShown: Record<string, string> = {
    "lib/env.ts": "the operator's environment, checked at boot",
    "lib/server/sessions.ts": "the claims of the app's own signed cookie",
    "lib/server/mailbox.ts": "the local mail fake's stored messages",
    "lib/bench/sketch-state.ts": "every field falls back with .catch: the URL's sketch never refuses",
    "lib/server/upload-router.ts": "the upload route's input, checked again by completeUpload's own refusals",
  };

  function sources(dir: string): string[] {
    return readdirSync(dir).flatMap((entry) => {
      const path = join(dir, entry);
      if (statSync(path).isDirectory()) return sources(path);
      return /\.tsx?$/.test(entry) ? [path] : [];
    });
  }

  it("lists every file that builds a zod object", () => {
    const root = process.cwd();
    const files = [...sources(join(root, "lib")), ...sources(join(root, "app"))]
      .filter((file) => readFileSync(file, "utf8").includes("z.object("))
      .map((file) => relative(root, file));
    const unlisted = files.filter((file) => !walked.has(file) && !onlyThroughParseOrThrow.has(file) && !(file in neverShown));
    expect(unlisted).toEqual([]);
    for (const file of onlyThroughParseOrThrow) expect(readFileSync(join(root, file), "utf8"), file).toMatch(/parseOrThrow\(/);
  });
});
