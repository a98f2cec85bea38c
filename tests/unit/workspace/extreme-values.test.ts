import { defaultPhotometrySettings } from "@/lib/workspace/photometry-schema";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { computeResults } from "@/lib/bench/compute-results";
import { parseSketch } from "@/lib/bench/parse-sketch";
import { demoSketch, type Sketch } from "@/lib/bench/sketch-state";
import { proposeColumnMapping } from "@/lib/imports/columns";
import { parseCsvTable } from "@/lib/imports/csv";
import { validateImportRows } from "@/lib/imports/rows";
import { deriveTargetColumns } from "@/lib/workspace/derived";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";
import { scienceCaseIds } from "@/lib/lensing/science-case-inputs";
import { createTargetSchema, lensHypothesisErrors } from "@/lib/workspace/target-schema";

/**
 * Tiny and huge values of every numeric input, each through the computation it feeds: either the
 * boundary refuses it with a field error, or every derived number is finite. Regression family of the
 * fast-check counterexample (seed 1845155118) where a lens distance of 5e-324 pc made θ_E = Infinity
 * and the target PATCH answer a 500.
 */

/** IEEE 754 extremes: subnormals, the smallest normal, the largest double, and plain huge and tiny values. */
const extremes = [5e-324, 1e-320, 2.2250738585072014e-308, 1e-300, 1e-30, 1e-15, 1e-6, 1e-3, 1, 1e3, 1e6, 1e15, 1e16, 1e30, 1e300, Number.MAX_VALUE, 0, -0, -1];
const extremeNumber = fc.oneof({ weight: 3, arbitrary: fc.constantFrom(...extremes) }, { weight: 1, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) });

const pointByDistance = { lensModel: "point", lensMassSolar: 0.5, lensDistancePc: 4000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.3, properMotionMasPerYr: 5 };
const sisByRedshift = { lensModel: "sis", velocityDispersionKmPerS: 250, lensRedshift: 0.4, sourceRedshift: 1.8, sourceOffsetThetaE: 0.3, properMotionMasPerYr: 0.01 };
const sisByDistance = { lensModel: "sis", velocityDispersionKmPerS: 250, lensDistancePc: 1e9, sourceDistancePc: 3e9, sourceOffsetThetaE: 0.3, properMotionMasPerYr: 0.01 };
const numericTargetFields = ["lensMassSolar", "velocityDispersionKmPerS", "lensDistancePc", "sourceDistancePc", "lensRedshift", "sourceRedshift", "sourceOffsetThetaE", "properMotionMasPerYr", "sourceRadiusSolar", "sourceRadiusThetaE", "limbDarkeningU", "einsteinTimeDays", "parallaxNorth", "parallaxEast"] as const;
const instrument = instrumentSchema.parse({ resolutionMas: 0.025, cadenceHours: 24, campaignLengthDays: 90, astrometricPrecisionMas: 0.1, reachableContrast: 100 });
/** Settings without cycle dates: no schedule, so these tests exercise the lensing and its rules alone. */
const settings = (i: typeof instrument) => ({ site: { name: "S", latitudeDeg: -30, longitudeDeg: -70, elevationM: 2000, horizonLimitDeg: 20 }, instrument: i, photometry: defaultPhotometrySettings, cycleStartDate: null, cycleEndDate: null });

/** No answer's words may show a number that is not one. */
const expectWordsFinite = (answers: { figure: string; sentence: string }[], context: string) => {
  for (const answer of answers) expect(`${answer.figure} ${answer.sentence}`, context).not.toMatch(/NaN|Infinity|undefined|null/);
};

const derivedNumbers = ["einsteinRadiusMas", "imageSeparationMas", "magnificationTotal", "timeDelayDays", "crossingTimeDays", "shadowDiameterMicroarcsec"] as const;

describe("every numeric target field, tiny or huge", () => {
  const bases = { pointByDistance, sisByRedshift, sisByDistance };
  for (const [baseName, base] of Object.entries(bases)) {
    it(`is refused by field or derives finite columns (${baseName}, up to three fields bent at once)`, () => {
      const bent = fc.dictionary(fc.constantFrom(...numericTargetFields), extremeNumber, { minKeys: 1, maxKeys: 3 });
      fc.assert(
        fc.property(bent, (changes) => {
          const input = { name: "T", ra: 10, dec: 10, priority: 1, ...base, ...changes };
          const parsed = createTargetSchema.safeParse(input);
          if (!parsed.success) {
            // Each refusal names one of the fields the user sent, in words.
            for (const issue of parsed.error.issues) expect(Object.keys(input)).toContain(String(issue.path[0]));
            return;
          }
          if (Object.keys(lensHypothesisErrors(parsed.data)).length > 0) return;
          for (const scienceCase of scienceCaseIds) {
            const derived = deriveTargetColumns({ ...parsed.data, scienceCase }, settings(instrument), null);
            for (const key of derivedNumbers) {
              const value = derived[key];
              if (value !== null) expect(Number.isFinite(value), `${key} = ${value} for ${JSON.stringify(changes)}`).toBe(true);
            }
            expectWordsFinite(derived.caseAnswers, `${scienceCase} ${JSON.stringify(changes)}`);
            const separation = derived.caseAnswers.find((answer) => answer.id === "image-separation");
            if (derived.imageSeparationMas !== null && separation) expect(separation.verdict).not.toBe("unknown");
          }
        }),
        { numRuns: 400 },
      );
    });
  }

  it("refuses the counterexample 5e-324 pc by the lens distance field, in words", () => {
    const result = createTargetSchema.safeParse({ name: "T", ra: 10, dec: 10, priority: 1, ...pointByDistance, lensDistancePc: 5e-324 });
    expect(result.success).toBe(false);
    expect(result.error!.issues.map((i) => [i.path.join("."), i.message])).toEqual([
      ["lensDistancePc", "The lens distance is from 1 × 10⁻⁶ to 20\u202f000\u202f000\u202f000 parsecs (0.2 au to beyond the observable universe)."],
    ]);
  });

  it("refuses a heavy lens too close for the thin-lens formulas on the mass and the distance", () => {
    expect(Object.keys(lensHypothesisErrors({ ...pointByDistance, lensModel: "point", lensMassSolar: 1e16, lensDistancePc: 1e-6 }))).toEqual(["lensMassSolar", "lensDistancePc"]);
  });

  it("derives nothing, rather than throwing, for a stored row outside today's ranges", () => {
    const stored = { ...pointByDistance, lensModel: "point" as const, lensDistancePc: 5e-324 };
    expect(() => deriveTargetColumns(stored, settings(instrument), null)).not.toThrow();
    expect(deriveTargetColumns(stored, settings(instrument), null)).toMatchObject({ einsteinRadiusMas: null, caseVerdict: "unknown", caseAnswers: [] });
  });
});

describe("every numeric instrument default, tiny or huge", () => {
  const fields = ["resolutionMas", "cadenceHours", "campaignLengthDays", "astrometricPrecisionMas", "reachableContrast", "visitMinutes", "clearNightFraction"] as const;
  it("is refused by field or grades every question it feeds (no infinite ratio becomes 'unknown')", () => {
    fc.assert(
      fc.property(fc.constantFrom(...fields), extremeNumber, (field, value) => {
        const parsed = instrumentSchema.safeParse({ ...instrument, [field]: value });
        if (!parsed.success) {
          expect(parsed.error.issues.map((i) => String(i.path[0]))).toEqual([field]);
          return;
        }
        for (const scienceCase of ["resolved-images", "photometric-microlensing", "astrometric-microlensing"] as const) {
          const derived = deriveTargetColumns({ ...(pointByDistance as Parameters<typeof deriveTargetColumns>[0]), scienceCase }, settings(parsed.data), null);
          expectWordsFinite(derived.caseAnswers, `${field} = ${value}`);
          // Only a question whose input is missing (the schedule, t0: it says "Set …") may lack an answer.
          for (const answer of derived.caseAnswers) if (!/^Set /.test(answer.sentence)) expect(answer.verdict, `${answer.id}: ${answer.sentence}`).not.toBe("unknown");
        }
      }),
      { numRuns: 200 },
    );
  });
});

describe("every bench field, tiny or huge", () => {
  const unitOf: Partial<Record<keyof Sketch, string>> = {
    mass: "Msun",
    sigma: "km/s",
    dl: "pc",
    ds: "pc",
    mu: "mas/yr",
    t0: "d",
    fwhm: "mas",
    lambda: "m",
    baseline: "m",
    cadence: "d",
    campaign: "d",
  };
  const numericFields = ["mass", "sigma", "dl", "ds", "zl", "zs", "h0", "om0", "beta", "mu", "t0", "u0", "fwhm", "lambda", "baseline", "cadence", "campaign"] as const;
  const shapes = [
    {},
    { lens: "sis" },
    { geometry: "redshift" },
    { lens: "sis", geometry: "redshift" },
    { betaUnit: "angle", beta: "1 mas" },
    { resolution: "fwhm" },
  ] as const;

  it("is refused beside its field, or computes finite results", () => {
    const bent = fc.dictionary(fc.constantFrom(...numericFields), extremeNumber, { minKeys: 1, maxKeys: 3 });
    fc.assert(
      fc.property(fc.constantFrom(...shapes), bent, (shape, changes) => {
        const typed = Object.fromEntries(Object.entries(changes).map(([field, value]) => [field, `${value}${unitOf[field as keyof Sketch] ? ` ${unitOf[field as keyof Sketch]}` : ""}`]));
        const sketch = { ...demoSketch, ...shape, ...typed } as Sketch;
        const parsed = parseSketch(sketch);
        if (!parsed.ok) {
          for (const message of Object.values(parsed.fieldErrors)) expect(message).not.toMatch(/Rad\b|Pc\b|Solar\b|got /);
          return;
        }
        const computed = computeResults(parsed.inputs);
        expect(computed.ok, JSON.stringify({ changes, computed })).toBe(true);
        if (!computed.ok) return;
        // A row without a value (NaN, shown as "—") must say why in its note.
        for (const row of computed.results.rows) expect(Number.isFinite(row.value) || row.note !== undefined, `${row.id} = ${row.value} for ${JSON.stringify(typed)}`).toBe(true);
        for (const row of computed.results.deflections) expect(Number.isFinite(row.exactRad), `${row.id} for ${JSON.stringify(typed)}`).toBe(true);
      }),
      { numRuns: 400 },
    );
  });
});

describe("every numeric import cell, tiny or huge", () => {
  const header = "name,ra,dec,mass [Msun],D_L [pc],D_S [pc],u0,mu_rel [mas/yr],priority";
  it("gives each row a target or errors naming the row, never a throw", () => {
    fc.assert(
      fc.property(fc.array(extremeNumber, { minLength: 5, maxLength: 5 }), (cells) => {
        const table = parseCsvTable(`${header}\nT,10,10,${cells.join(",")},2`);
        const { rows } = validateImportRows(table, proposeColumnMapping(table.columns));
        const [row] = rows;
        if (row.target === undefined) expect(row.errors[0]).toMatch(/^row 1: /);
        else expect(deriveTargetColumns(row.target, settings(instrument), null).einsteinRadiusMas).toBeGreaterThan(0);
      }),
      { numRuns: 200 },
    );
  });
});
