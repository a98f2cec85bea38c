import { describe, expect, it } from "vitest";
import { PERIAPSIS_WINDOW_FRACTION } from "@/lib/lensing/feasibility-rules";
import { relativisticOrbitOf } from "@/lib/lensing/relativistic-orbit";
import { relativisticOrbitAnswers } from "@/lib/lensing/science-case-orbit";
import { defaultScienceCase, scienceCaseQuestions } from "@/lib/lensing/science-cases";
import type { InstrumentSettings, OrbitInputs } from "@/lib/lensing/science-case-inputs";
import type { CaseAnswer, CaseQuestionId, ScienceCaseInputs } from "@/lib/lensing/science-case-questions";
import type { LensSolution } from "@/lib/lensing/solution";
import { einsteinRadius, JULIAN_YEAR_S, DAY_S, pointLensImages, shadowAngularDiameter } from "@/lib/physics";
import { observingSchedule } from "@/lib/schedule";
import { southSite } from "../schedule/sites";
import { CYCLE_START_JD, nightlySchedule } from "./nightly-schedule";
import { noOrbit, S2 } from "./orbit-inputs";

/** Sgr A* as the compact lens: 4.261 × 10⁶ M☉ at 8246.7 pc before a distant source (only compactness matters here). */
function compactLens(): LensSolution {
  const thetaERad = einsteinRadius(4.261e6, 8246.7, 1e9);
  const images = pointLensImages(1);
  return {
    modelId: "point",
    einsteinRadiusRad: thetaERad,
    sourceOffsetThetaE: 1,
    images: [],
    imageSeparationRad: (images.thetaPlus - images.thetaMinus) * thetaERad,
    magnificationTotal: images.magnificationTotal,
    fluxRatio: images.magnificationPlus / -images.magnificationMinus,
    timeDelayS: null,
    einsteinTimeS: null,
    centroidShiftRad: images.centroidShift * thetaERad,
    maxAstrometricShiftRad: thetaERad / Math.sqrt(8),
    shadowDiameterRad: shadowAngularDiameter(4.261e6, 8246.7),
    photonRingDiameterRad: null,
    microlensParallax: null,
  };
}

const noInstrument: InstrumentSettings = { psfFwhmMas: null, interferometer: null, astrometricPrecisionMas: null, reachableContrast: null, spectroscopicPrecisionKmPerS: null };

/** A 183-night cycle from 2027-03-01, the target up on nights 20–160, one visit a night at 01:00 UTC. */
const schedule = nightlySchedule({ nights: 183, seasonFirstNight: 20, seasonLastNight: 160, cadenceHours: 24 });

/** 04:00 UTC of night `night` of the cycle. */
const nightJd = (night: number) => CYCLE_START_JD + night + 4 / 24;

/**
 * A star close to Sgr A*: a = 142 au, e = 0.9, P = 300 d (Kepler's period for 4.261 × 10⁶ M☉ is 300 d
 * to 0.3 %), periapsis 14.2 au = 338 GM/c²; the periapsis window ±10 % of P is ±30 d.
 */
const tightStar: OrbitInputs = {
  ...noOrbit,
  centralMassSolar: 4.261e6,
  distancePc: 8246.7,
  semiMajorAxisAu: 142,
  eccentricity: 0.9,
  periodDays: 300,
  periapsisJdUtc: nightJd(90),
  inclinationDeg: 60,
  nodeDeg: 120,
  periapsisArgumentDeg: 30,
};
const tight = (() => {
  const outcome = relativisticOrbitOf(tightStar);
  if ("missing" in outcome) throw new Error(outcome.missing);
  return outcome.orbit;
})();

function inputs(orbit: Partial<OrbitInputs> = {}, instrument: Partial<InstrumentSettings> = {}, overrides: Partial<ScienceCaseInputs> = {}): ScienceCaseInputs {
  return {
    solution: compactLens(),
    event: { peakJdUtc: null, impactParameterThetaE: null, sourceRadiusThetaE: null, limbDarkeningU: 0 },
    instrument: { ...noInstrument, ...instrument },
    schedule,
    campaign: { lengthDays: null, cadenceHours: 24 },
    photonBudget: { notApplicable: true },
    orbit: { ...tightStar, ...orbit },
    ...overrides,
  };
}

function answer(answers: CaseAnswer[], id: CaseQuestionId): CaseAnswer {
  const found = answers.find((a) => a.id === id);
  if (found === undefined) throw new Error(`no answer ${id} among ${answers.map((a) => a.id).join(", ")}`);
  return found;
}

const ask = (id: CaseQuestionId, ...args: Parameters<typeof inputs>) => answer(relativisticOrbitAnswers(inputs(...args)), id);

describe("the next periapsis against the season (our rule)", () => {
  it("in the season: feasible, dated, and the same from an earlier passage five periods back", () => {
    const season = ask("periapsis-season");
    expect(season).toMatchObject({ verdict: "feasible", figure: "2027-05-30, in season" });
    expect(season.sentence).toBe(
      "The next periapsis after the cycle's start is on 2027-05-30 04:00 UTC (period 300 d), within the target's observing season at this site: the passage itself can be observed.",
    );
    expect(ask("periapsis-season", { periapsisJdUtc: nightJd(90) - 5 * 300 })).toEqual(season);
  });

  it("in the season gap with usable time within ±10 % of the period: marginal", () => {
    // Night 175, 04:00 UTC; the season's last window ends at 07:00 UTC of night 160: 14.875 d before.
    const season = ask("periapsis-season", { periapsisJdUtc: nightJd(175) });
    expect(season.verdict).toBe("marginal");
    expect(season.sentence).toBe(
      "The next periapsis after the cycle's start is on 2027-08-23 04:00 UTC (period 300 d) and falls in the season gap: at that time of year the target is not up in darkness, being too close to the Sun in the sky; the nearest usable time is 14.9 d away, within ±10 % of the period (30 d): the approach to or the recession from periapsis is observed, not the passage.",
    );
  });

  it("after the cycle, beyond the window: infeasible", () => {
    // Night 200 is after the 183-night cycle and 39.9 d after the last usable time.
    const season = ask("periapsis-season", { periapsisJdUtc: nightJd(200) });
    expect(season).toMatchObject({ verdict: "infeasible", figure: "2027-09-17, 39.9 d from usable time" });
    expect(season.sentence).toMatch(/, after the cycle ends \(2027-08-31\); the nearest usable time is 39\.9 d away, beyond ±10 % of the period \(30 d\): the passage is not observed in this cycle\.$/);
  });

  it("asks for the periapsis time, the orbit and the schedule in words", () => {
    expect(ask("periapsis-season", { periapsisJdUtc: null })).toMatchObject({ verdict: "unknown", sentence: "Set the time of one periapsis passage of the star to date its next periapsis." });
    expect(ask("periapsis-epochs", { periapsisJdUtc: Number.NaN })).toMatchObject({ verdict: "unknown", sentence: "The time of periapsis must be a date." });
    expect(ask("periapsis-season", { eccentricity: null })).toMatchObject({ verdict: "unknown", sentence: "Set the orbit's eccentricity to compute the star's orbit." });
    expect(ask("periapsis-season", {}, {}, { schedule: null })).toMatchObject({ verdict: "unknown", sentence: expect.stringMatching(/^Set the observing site and the cycle's first and last nights/) });
  });
});

describe("visits within ±10 % of the period around periapsis (our rule)", () => {
  it("counts one visit a night over ±30 d: 60 visits, feasible", () => {
    expect(PERIAPSIS_WINDOW_FRACTION * tight.periodDays).toBe(30);
    // Window 04:00 UTC of night 60 to night 120; the visits at 01:00 UTC of nights 61–120.
    const epochs = ask("periapsis-epochs");
    expect(epochs).toMatchObject({ verdict: "feasible", figure: "60 visits within ±30 d of periapsis" });
    expect(epochs.sentence).toBe(
      "The schedule collects 60 visits within ±10 % of the period around the periapsis of 2027-05-30 (2027-04-30 04:00 UTC to 2027-06-29 04:00 UTC): enough to trace the passage (ten or more).",
    );
  });

  it("a passage at the season's end: three visits, marginal, and the cycle covering part of the window", () => {
    // Night 187: window from night 157.17; visits on nights 158, 159, 160; the cycle ends at night 183.
    const epochs = ask("periapsis-epochs", { periapsisJdUtc: nightJd(187) });
    expect(epochs).toMatchObject({ verdict: "marginal", figure: "3 visits within ±30 d of periapsis" });
    expect(epochs.sentence).toContain("the passage is sampled, not traced (three to nine). The cycle covers only 25.8 d of the 60 d window.");
  });

  it("a passage outside the season: no visit, infeasible", () => {
    expect(ask("periapsis-epochs", { periapsisJdUtc: nightJd(200) })).toMatchObject({ verdict: "infeasible", figure: "0 visits within ±30 d of periapsis" });
  });
});

describe("the precession signal: the apoapsis shift per orbit against the astrometric precision", () => {
  // The exact advance 0.0296 rad = 1.7° per orbit moves the apoapsis (269.8 au at 8246.7 pc) by 648 µas
  // projected; over the 60 periapsis visits √60 = 7.75 precisions-per-epoch combine.
  it("grades (shift/σ)√N: 10σ feasible, 3.9σ marginal, 1.7σ infeasible (common practice 5σ / 3σ)", () => {
    expect(tight.apoapsisShiftMicroarcsec).toBeCloseTo(647.6, 1);
    const feasible = ask("precession-signal", {}, { astrometricPrecisionMas: 0.5 });
    expect(feasible).toMatchObject({ verdict: "feasible", figure: "10σ: 648 µas over 60 visits at 500 µas" });
    expect(feasible.sentence).toBe(
      "The periapsis advances 1.7° per orbit (exact Schwarzschild; 1.68° to first order), moving the apoapsis by 648 µas on the sky: 1.3 times the precision per epoch of 500 µas; the 60 visits within ±10 % of the period around periapsis measure it at 10σ: a detection.",
    );
    expect(ask("precession-signal", {}, { astrometricPrecisionMas: 1.3 })).toMatchObject({ verdict: "marginal", figure: expect.stringMatching(/^3\.86σ/) });
    expect(ask("precession-signal", {}, { astrometricPrecisionMas: 3 })).toMatchObject({ verdict: "infeasible", figure: expect.stringMatching(/^1\.67σ/) });
  });

  it("without the orientation the shift is the face-on bound, said so", () => {
    const bound = ask("precession-signal", { inclinationDeg: null, nodeDeg: null, periapsisArgumentDeg: null }, { astrometricPrecisionMas: 0.5 });
    expect(bound.sentence).toContain("on the sky at most (the orbit seen face-on; set the inclination and the argument of periapsis for its projection)");
  });

  it("asks for the distance, the precision and the schedule, keeping what is known", () => {
    expect(ask("precession-signal", { distancePc: null }, { astrometricPrecisionMas: 0.5 })).toMatchObject({
      verdict: "unknown",
      figure: "1.7°",
      sentence: "The periapsis advances 1.7° per orbit (exact Schwarzschild; 1.68° to first order). Set the lens distance to turn the apoapsis' shift into an angle on the sky.",
    });
    expect(ask("precession-signal")).toMatchObject({ verdict: "unknown", figure: "648 µas", sentence: expect.stringMatching(/Set the astrometric precision per epoch to compare the shift with it\.$/) });
    expect(ask("precession-signal", {}, { astrometricPrecisionMas: 0.5 }, { schedule: null })).toMatchObject({
      verdict: "unknown",
      sentence: expect.stringMatching(/^The periapsis advances .*: 1\.3 times the precision per epoch of 500 µas\. Set the observing site/),
    });
  });
});

describe("the redshift signal against the spectroscopic precision", () => {
  // Periapsis 338 GM/c²: gravitational c/338 = 888 km/s, transverse Doppler (1 + e)/2 of it = 844 km/s.
  it("grades one epoch at periapsis: 17σ feasible, 4.3σ marginal, 1.7σ infeasible (common practice 5σ / 3σ)", () => {
    const feasible = ask("redshift-signal", {}, { spectroscopicPrecisionKmPerS: 100 });
    expect(feasible).toMatchObject({ verdict: "feasible", figure: "1730 km/s = 17.3 × the precision (100 km/s)" });
    expect(feasible.sentence).toBe(
      "At periapsis (14.2 au, 338 GM/c²) the star moves at 22500 km/s; its redshift, gravitational 888 km/s plus transverse Doppler 844 km/s, is 1730 km/s (c·z, first order in (v/c)²): 17.3 times the spectroscopic precision of 100 km/s per epoch, so one epoch at periapsis detects it.",
    );
    expect(ask("redshift-signal", {}, { spectroscopicPrecisionKmPerS: 400 }).verdict).toBe("marginal");
    expect(ask("redshift-signal", {}, { spectroscopicPrecisionKmPerS: 1000 }).verdict).toBe("infeasible");
  });

  it("asks for the spectroscopic precision, and needs no schedule", () => {
    expect(ask("redshift-signal", {}, {}, { schedule: null })).toMatchObject({
      verdict: "unknown",
      figure: "1730 km/s",
      sentence: expect.stringMatching(/Set the spectroscopic \(radial-velocity\) precision per epoch to compare the redshift with it\.$/),
    });
  });
});

describe("S2 with the simulated schedule of a southern site (lib/schedule)", () => {
  // GRAVITY 2020 elements (from memory); periapsis 2018.379 = J2000 + 18.379 Julian years.
  const s2Periapsis = 2_451_545 + (18.379 * JULIAN_YEAR_S) / DAY_S;
  const sgrA = { name: "Sgr A*", raDeg: 266.417, decDeg: -29.008 };

  it("the next periapsis, June 2034, falls in the Galactic centre's season; 0.8 mas of apoapsis shift and 206 km/s of redshift", () => {
    const siteSchedule = observingSchedule({
      site: southSite,
      target: sgrA,
      cycleStartNightIso: "2034-03-01",
      cycleEndNightIso: "2034-08-31",
      limits: { airmassLimit: 2 },
      cadenceHours: 24,
      visitMinutes: 20,
    });
    const answers = scienceCaseQuestions(
      "relativistic-orbit",
      inputs({ ...S2, periapsisJdUtc: s2Periapsis }, { astrometricPrecisionMas: 0.05, spectroscopicPrecisionKmPerS: 10 }, { schedule: siteSchedule }),
    );
    expect(answer(answers, "periapsis-season")).toMatchObject({ verdict: "feasible", figure: expect.stringMatching(/^2034-06-0\d, in season$/) });
    // The ±586 d (1.6 yr) window spans the whole six-month cycle: every visit counts.
    expect(answer(answers, "periapsis-epochs").figure).toBe(`${siteSchedule.visitsJdUtc.length} visits within ±586 d of periapsis`);
    expect(answer(answers, "precession-signal")).toMatchObject({ verdict: "feasible", sentence: expect.stringContaining("moving the apoapsis by 799 µas on the sky") });
    expect(answer(answers, "redshift-signal")).toMatchObject({ verdict: "feasible", figure: "206 km/s = 20.6 × the precision (10 km/s)" });
  });
});

describe("the default science case: a compact lens with an orbiting star (our rule)", () => {
  it("is a relativistic orbit, before the other rules", () => {
    const chosen = defaultScienceCase(compactLens(), { ...noInstrument, interferometer: { wavelengthMm: 1.3, longestBaselineKm: 10_700 } }, tightStar);
    expect(chosen).toEqual({
      caseId: "relativistic-orbit",
      reason: "A star orbits the compact lens (a = 142 au, e = 0.9, periapsis at 338 GM/c²), so its periapsis passages show the orbit's relativistic precession, 1.7° per orbit, and redshift: relativistic orbit.",
    });
  });

  it("is not chosen for incomplete elements or an extended lens", () => {
    // Without the orbit the shadow (52 µas) against λ/B = 25 µas makes it horizon-scale imaging.
    const eht = { ...noInstrument, interferometer: { wavelengthMm: 1.3, longestBaselineKm: 10_700 } };
    expect(defaultScienceCase(compactLens(), eht, { ...tightStar, eccentricity: null }).caseId).toBe("horizon-scale");
    const extended = { ...compactLens(), shadowDiameterRad: null, timeDelayS: 40 * DAY_S };
    expect(defaultScienceCase(extended, { ...noInstrument, psfFwhmMas: 1e6 }, tightStar).caseId).toBe("time-delay");
  });
});
