import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { benchCaseReport, benchSchedule, benchScheduleRequest, type BenchSchedule } from "@/lib/bench/case-report";
import { computeResults } from "@/lib/bench/compute-results";
import { parseSketch } from "@/lib/bench/parse-sketch";
import { sketchFromSearchParams } from "@/lib/bench/sketch-state";
import { scienceCaseIds, type ScienceCaseId } from "@/lib/lensing/science-case-inputs";
import { DAY_S, MICROARCSECOND_RAD, MILLIARCSECOND_RAD } from "@/lib/physics";
import type { ObservingSchedule } from "@/lib/schedule";
import { benchLink, hypothesisFromSketch, type BenchTarget } from "@/lib/workspace/bench-link";
import { deriveTargetColumns, targetSchedules, type DerivedColumns } from "@/lib/workspace/derived";
import { FIXED_PROPERTY_SEED } from "../../support/property-seed";
import { positions, proposals } from "./proposal-fixtures";

const HYPOTHESES = 240;

/** A value as people type it: four significant digits. */
const typed = (arbitrary: fc.Arbitrary<number>) => arbitrary.map((value) => Number(value.toPrecision(4)));
const logUniform = (minExp: number, maxExp: number) => typed(fc.double({ min: minExp, max: maxExp, noNaN: true }).map((e) => 10 ** e));
const orNull = <T,>(arbitrary: fc.Arbitrary<T>) => fc.option(arbitrary, { nil: null });

/** Julian dates around the fixture cycles (2027-01 to 2027-12), to the minute or so. */
const peakJd = fc.double({ min: 2_461_400, max: 2_461_770, noNaN: true }).map((jd) => Math.round(jd * 1e4) / 1e4);

const geometry = fc.oneof(
  fc.record({ dl: logUniform(1.5, 3.9), share: fc.double({ min: 0.05, max: 0.95, noNaN: true }) }).map(({ dl, share }) => ({
    lensDistancePc: dl,
    sourceDistancePc: Number((dl / share).toPrecision(4)) > dl ? Number((dl / share).toPrecision(4)) : dl * 2,
    lensRedshift: null,
    sourceRedshift: null,
  })),
  fc.record({ zl: typed(fc.double({ min: 0.05, max: 1.5, noNaN: true })), dz: typed(fc.double({ min: 0.1, max: 3, noNaN: true })) }).map(({ zl, dz }) => ({
    lensDistancePc: null,
    sourceDistancePc: null,
    lensRedshift: zl,
    sourceRedshift: Number((zl + dz).toPrecision(4)),
  })),
);

const lens = fc.oneof(
  logUniform(-3, 7).map((mass) => ({ lensModel: "point" as const, lensMassSolar: mass, velocityDispersionKmPerS: null })),
  typed(fc.double({ min: 50, max: 1200, noNaN: true })).map((sigma) => ({ lensModel: "sis" as const, lensMassSolar: null, velocityDispersionKmPerS: sigma })),
);

const sourceSize = fc.oneof(
  fc.constant({ sourceRadiusSolar: null, sourceRadiusThetaE: null }),
  logUniform(-1, 2).map((radius) => ({ sourceRadiusSolar: radius, sourceRadiusThetaE: null })),
  logUniform(-3.5, -0.5).map((rho) => ({ sourceRadiusSolar: null, sourceRadiusThetaE: rho })),
);

const target = fc
  .record({
    lens,
    geometry,
    sourceSize,
    sourceOffsetThetaE: logUniform(-2, 0.4),
    properMotionMasPerYr: orNull(logUniform(-1, 1.3)),
    // The team's case in four of five hypotheses (each case alike), else the inferred one.
    scienceCase: fc.oneof({ arbitrary: fc.constantFrom<ScienceCaseId>(...scienceCaseIds), weight: 4 }, { arbitrary: fc.constant(null), weight: 1 }),
    eventPeakJdUtc: orNull(peakJd),
    limbDarkeningU: orNull(typed(fc.double({ min: 0, max: 1, noNaN: true }))),
    position: fc.nat(positions.length - 1),
    proposal: fc.nat(proposals.length - 1),
  })
  .map(({ lens, geometry, sourceSize, position, proposal, ...rest }) => ({
    target: { ...lens, ...geometry, ...sourceSize, ...rest, ...positions[position] } satisfies BenchTarget,
    position,
    proposal,
  }));

/** The stored side: every target of a proposal scheduled together, as the server re-derives them. */
const storedSchedules: (ObservingSchedule | null)[][] = proposals.map((proposal) => targetSchedules(proposal, positions));

/** The bench's side: its own schedule, from its parsed settings, as the worker computes it (one per sketch setting). */
const benchSchedules = new Map<string, BenchSchedule>();
function benchScheduleOf(request: ReturnType<typeof benchScheduleRequest>): BenchSchedule {
  if (request === null) return { status: "none" };
  const key = JSON.stringify(request);
  let schedule = benchSchedules.get(key);
  if (schedule === undefined) {
    schedule = { status: "done", schedule: benchSchedule(request) };
    benchSchedules.set(key, schedule);
  }
  return schedule;
}

/** The bench's shown numbers in the stored columns' units; null where the bench shows no value. */
function benchNumbers(rows: { id: string; value: number }[]): Pick<DerivedColumns, "einsteinRadiusMas" | "imageSeparationMas" | "magnificationTotal" | "timeDelayDays" | "crossingTimeDays" | "shadowDiameterMicroarcsec"> {
  const value = (id: string, scale: number) => {
    const row = rows.find((r) => r.id === id);
    return row === undefined || Number.isNaN(row.value) ? null : row.value / scale;
  };
  return {
    einsteinRadiusMas: value("theta-e", MILLIARCSECOND_RAD),
    imageSeparationMas: value("separation", MILLIARCSECOND_RAD),
    magnificationTotal: value("mu-total", 1),
    timeDelayDays: value("time-delay", DAY_S),
    crossingTimeDays: value("t-e", DAY_S),
    shadowDiameterMicroarcsec: value("shadow", MICROARCSECOND_RAD),
  };
}

describe("the lens bench and the stored target grade a hypothesis alike", () => {
  const samples = fc.sample(target, { seed: FIXED_PROPERTY_SEED, numRuns: HYPOTHESES });

  it("gives the same schedule on the bench (one target, in the worker) as on the server (all targets of the proposal)", () => {
    proposals.forEach((proposal, p) => {
      positions.forEach((position, t) => {
        const stored = storedSchedules[p][t];
        const bench = benchScheduleOf(benchScheduleRequest(parsedOf({ ...samples[0].target, ...position }, p)));
        if (stored === null) expect(bench.status).toBe("none");
        else expect(bench.status === "done" && bench.schedule).toEqual(stored);
      });
    });
  });

  it(`shows the same numbers and the same case answers for ${HYPOTHESES} hypotheses across every case and both lens models`, () => {
    const pairs = new Map<string, number>();
    let largestNumberDifference = 0;
    let scheduledAnswers = 0;
    for (const { target: t, position, proposal } of samples) {
      const { raDeg: _ra, decDeg: _dec, ...h }: BenchTarget = t;
      const stored = deriveTargetColumns(h, proposals[proposal], storedSchedules[proposal][position]);
      expect(stored.answeredCase, "every generated hypothesis is solvable").not.toBeNull();
      const inputs = parsedOf(t, proposal);
      // The bench grades what "Save as target" would store: the target's own inputs.
      expect(hypothesisFromSketch(inputs)).toEqual(h);
      const computed = computeResults(inputs);
      if (!computed.ok) throw new Error(computed.message);
      const report = benchCaseReport(inputs, benchScheduleOf(benchScheduleRequest(inputs)));
      expect(report?.scienceCase.caseId ?? null).toBe(stored.answeredCase);
      expect(report?.answers ?? []).toEqual(stored.caseAnswers);

      const shown = benchNumbers(computed.results.rows);
      for (const key of Object.keys(shown) as (keyof typeof shown)[]) {
        const [bench, derived] = [shown[key], stored[key]];
        expect(bench === null, `${key} of ${JSON.stringify(t)}`).toBe(derived === null);
        if (bench !== null && derived !== null) largestNumberDifference = Math.max(largestNumberDifference, Math.abs(bench / derived - 1));
      }
      const pair = `${t.lensModel}/${stored.answeredCase}`;
      pairs.set(pair, (pairs.get(pair) ?? 0) + 1);
      scheduledAnswers += stored.caseAnswers.filter((a) => /schedule collects/.test(a.sentence)).length;
    }
    // The parsers read "5200 pc" and "6.1 mas/yr" back to the last bit or within a rounding.
    expect(largestNumberDifference).toBeLessThan(1e-13);
    // Every case with each lens model, and answers counted from simulated nights.
    for (const model of ["point", "sis"]) for (const caseId of scienceCaseIds) expect(pairs.get(`${model}/${caseId}`) ?? 0, `${model}/${caseId}`).toBeGreaterThan(0);
    expect(scheduledAnswers).toBeGreaterThan(50);
    console.info(`bench/proposal agreement: ${samples.length} hypotheses; largest relative difference of a shown number ${largestNumberDifference.toExponential(1)}; ${scheduledAnswers} answers from a schedule; per model/case ${JSON.stringify(Object.fromEntries([...pairs].sort()))}`);
  });
});

/** Target → "Open in the lens bench" → the bench's parsed sketch. */
function parsedOf(t: BenchTarget, proposal: number) {
  const query = new URL(benchLink(t, proposals[proposal]), "http://arcwright.test").searchParams;
  const parsed = parseSketch(sketchFromSearchParams(Object.fromEntries(query)));
  if (!parsed.ok) throw new Error(`the bench refused ${JSON.stringify(t)}: ${JSON.stringify(parsed.fieldErrors)}`);
  return parsed.inputs;
}
