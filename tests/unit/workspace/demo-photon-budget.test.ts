import { describe, expect, it } from "vitest";
import { demoPhotometry, demoSourcePhotometry } from "@/db/seed/demo-photon-budget";
import { demoProposal, demoTargets } from "@/db/seed/demo-scenario";
import { demoCycle, demoInterferometer } from "@/db/seed/demo-sky-cycle";
import { parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";
import { deriveTargetColumns, targetSchedules, type FeasibilitySettings } from "@/lib/workspace/derived";
import { photometrySettingsSchema } from "@/lib/workspace/photometry-schema";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";
import { eventMagnificationAtOffset } from "@/lib/lensing/microlensing";
import { visitPhotometry } from "@/lib/photometry/visit-budget";
import { baselineMagnitude, magnifiedBlendMagnitude } from "@/lib/photometry/source-flux";
import { eventTimingOf, lensSolutionOf, photonBudgetInputsOf } from "@/lib/workspace/derived";
import { loadBudgetFixture } from "../photometry/budget-fixture";

/** The demo proposal as the seed stores it: its camera (db/seed/demo-photon-budget.ts), cycle and targets' sources. */
const settings: FeasibilitySettings = {
  site: demoProposal.site,
  instrument: instrumentSchema.parse({ ...demoProposal.instrument, ...demoInterferometer }),
  photometry: photometrySettingsSchema.parse(demoPhotometry),
  ...demoCycle,
};
const rows = demoTargets.map((t) => ({ ...t, ...demoSourcePhotometry[t.name], raDeg: parseRightAscensionDeg(t.ra), decDeg: parseDeclinationDeg(t.dec) }));
const schedules = targetSchedules(settings, rows);
const derived = new Map(rows.map((row, index) => [row.name, deriveTargetColumns(row, settings, schedules[index])]));

/** Every target with a photon budget: horizon-scale imaging (K-17 core) has none (an interferometer is not a CCD). */
const budgeted = [...derived].filter(([, columns]) => columns.answeredCase !== "horizon-scale");
const depthOf = (name: string) => derived.get(name)!.caseAnswers.find((answer) => answer.id === "depth")!;

describe("the demo proposal's photon budget", () => {
  it("grades every target's depth at its worst visit and names that visit's sky", () => {
    for (const [name, columns] of budgeted) {
      const depth = depthOf(name);
      expect(depth.verdict, `${name}: ${depth.sentence}`).not.toBe("unknown");
      expect(depth.sentence).toMatch(/^At the worst of the \d+ visits the case needs \(2031-\d\d-\d\d, air mass [\d.]+, Moon (down|\d+% lit \d+° away)\)/);
      expect(columns.timeRequestHours).toBeGreaterThan(0);
    }
  });

  it("asks no depth of the horizon-scale case", () => {
    expect(derived.get("K-17 core")!.caseAnswers.some((answer) => answer.id === "depth")).toBe(false);
    expect(derived.get("K-17 core")!.timeRequestHours).toBeNull();
  });

  it("fails the faint dwarf in a bright blend, and passes the bright giants", () => {
    // Cinder Bunting: Ks 23.4 with f_s = 0.1 at A(0.45) = 2.3: S/N 13 where 50 is asked (infeasible, our rule: below half).
    expect(depthOf("Cinder Bunting").verdict).toBe("infeasible");
    expect(depthOf("Cinder Bunting").sentence).toMatch(/reaches only S\/N 13\.\d in the 1110 s a visit leaves \(goal 50/);
    expect(depthOf("Cinder Avocet").verdict).toBe("feasible");
    expect(depthOf("Cinder Dunlin").sentence).toMatch(/The centroid is then measured to [\d.]+ mas \(photon-limited\)\./);
  });

  it("asks for exposures and overheads over the visits: fewer hours than whole visits, more than overheads alone", () => {
    // 20 min visits, 90 s overhead: each visit asks between 90 s and 1200 s.
    for (const [name, columns] of budgeted) {
      const visits = Number(/of the (\d+) visits/.exec(depthOf(name).sentence)![1]);
      expect(columns.timeRequestHours! * 3600, name).toBeGreaterThanOrEqual(visits * 90);
      expect(columns.timeRequestHours! * 3600, name).toBeLessThanOrEqual(visits * 1200 + 1e-6);
    }
  });
});

describe("one demo target's S/N at its peak, against the fixture generator's own calculation", () => {
  // tests/fixtures/generate_photometry.py, case "demo target Cinder Avocet at its peak": every step from
  // its paper in mpmath (Paczyński's A(u0), the blend, Bouguer extinction, the moonlit sky of
  // Krisciunas & Schaefer 1991, the Moffat PSF, Howell's CCD equation), none of our code.
  const fixture = loadBudgetFixture<{ cases: { input: Record<string, number | string> & { name: string }; expected: { signalToNoise: number; exposureForGoalS: number } }[] }>("visit-budget.json");
  const worked = fixture.cases.find((c) => c.input.name.startsWith("demo target Cinder Avocet"))!;

  it("reads the demo's camera and source through the product's own path to the same S/N", () => {
    const target = rows.find((row) => row.name === "Cinder Avocet")!;
    const solved = lensSolutionOf(target)!;
    const event = eventTimingOf(target, solved.solution, solved.geometry);
    const magnification = eventMagnificationAtOffset(event.impactParameterThetaE!, event);
    expect(magnification).toBeCloseTo(worked.input.magnification as number, 12);
    const inputs = photonBudgetInputsOf(target, settings);
    if (!("setup" in inputs)) throw new Error("the demo target has no photon budget");
    const visit = { airmass: 1.1, targetZenithDeg: 24.6, moonZenithDeg: 45, moonSeparationDeg: 70, moonPhaseAngleDeg: 90 };
    const magnitude = magnifiedBlendMagnitude(baselineMagnitude(inputs.source.sourceMagnitude, inputs.source.blendFraction), magnification, inputs.source.blendFraction);
    const result = visitPhotometry({ instrument: inputs.setup.instrument, sky: inputs.setup.sky, visit, magnitude, exposureS: inputs.setup.visitExposureS, signalToNoiseGoal: inputs.setup.signalToNoiseGoal });
    expect(inputs.setup.visitExposureS).toBe(worked.input.exposureS);
    expect(Math.abs(result.signalToNoise / worked.expected.signalToNoise - 1)).toBeLessThan(1e-6);
    expect(Math.abs(result.exposureForGoalS / worked.expected.exposureForGoalS - 1)).toBeLessThan(1e-6);
  });
});
