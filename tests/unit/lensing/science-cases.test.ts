import { describe, expect, it } from "vitest";
import { defaultScienceCase, scienceCaseLabels, scienceCaseQuestions } from "@/lib/lensing/science-cases";
import { scienceCaseIds, type InstrumentSettings, type ScienceCaseId } from "@/lib/lensing/science-case-inputs";
import type { CaseAnswer, CaseQuestionId, ScienceCaseInputs } from "@/lib/lensing/science-case-questions";
import type { LensSolution } from "@/lib/lensing/solution";
import {
  DAY_S,
  MICROARCSECOND_RAD,
  MILLIARCSECOND_RAD,
  JULIAN_YEAR_S,
  einsteinRadius,
  pointLensImages,
  pointLensMagnification,
  pointMassTimeDelay,
  shadowAngularDiameter,
  sisEinsteinRadius,
  sisImages,
} from "@/lib/physics";
import { observingSchedule } from "@/lib/schedule";
import type { EmptyScheduleReason } from "@/lib/schedule/types";
import { bulge as bulgeField, bulgeSeason, jd, southSite } from "../schedule/sites";
import { CYCLE_START_JD, nightlySchedule } from "./nightly-schedule";
import { noOrbit } from "./orbit-inputs";

// ── Builders: hand-made LensSolution and ObservingSchedule objects (the solve and the schedule are
// built elsewhere; here only their contract types are used). ──────────────────────────────────────

/** A point lens of `massSolar` at `dLensPc` before a source at `dSourcePc`, offset u, moving at `muMasPerYr`. */
function pointLens(massSolar: number, dLensPc: number, dSourcePc: number, u: number, muMasPerYr: number | null): LensSolution {
  const thetaERad = einsteinRadius(massSolar, dLensPc, dSourcePc);
  const images = pointLensImages(u);
  const shadowRad = shadowAngularDiameter(massSolar, dLensPc);
  return {
    modelId: "point",
    einsteinRadiusRad: thetaERad,
    sourceOffsetThetaE: u,
    images: [
      { positionThetaE: images.thetaPlus, magnification: images.magnificationPlus },
      { positionThetaE: images.thetaMinus, magnification: images.magnificationMinus },
    ],
    imageSeparationRad: (images.thetaPlus - images.thetaMinus) * thetaERad,
    magnificationTotal: images.magnificationTotal,
    fluxRatio: images.magnificationPlus / -images.magnificationMinus,
    timeDelayS: pointMassTimeDelay(massSolar, 0, u),
    einsteinTimeS: muMasPerYr === null ? null : thetaERad / ((muMasPerYr * MILLIARCSECOND_RAD) / JULIAN_YEAR_S),
    centroidShiftRad: images.centroidShift * thetaERad,
    maxAstrometricShiftRad: thetaERad / Math.sqrt(8),
    shadowDiameterRad: shadowRad,
    // The n = 1 ring lies just outside the shadow's edge (Virbhadra & Ellis 2000): a literal stand-in.
    photonRingDiameterRad: shadowRad * 1.0014,
    microlensParallax: null,
  };
}

/** An SIS of dispersion `sigmaKmPerS`, offset u < 1, with a delay of `delayDays` (given: no cosmology here). */
function isothermalSphere(sigmaKmPerS: number, u: number, delayDays: number): LensSolution {
  // Distances as ratios only: D_LS/D_S = 0.5.
  const thetaERad = sisEinsteinRadius(sigmaKmPerS, 0.5, 1);
  const images = sisImages(u * thetaERad, thetaERad);
  return {
    modelId: "sis",
    einsteinRadiusRad: thetaERad,
    sourceOffsetThetaE: u,
    images: [],
    imageSeparationRad: 2 * thetaERad,
    magnificationTotal: 2 / u,
    fluxRatio: Math.abs(images.magnificationPlus / images.magnificationMinus!),
    timeDelayS: delayDays * DAY_S,
    einsteinTimeS: null,
    centroidShiftRad: null,
    maxAstrometricShiftRad: null,
    shadowDiameterRad: null,
    photonRingDiameterRad: null,
    microlensParallax: null,
  };
}

const noInstrument: InstrumentSettings = { psfFwhmMas: null, interferometer: null, astrometricPrecisionMas: null, reachableContrast: null, spectroscopicPrecisionKmPerS: null };

// The textbook Galactic-bulge event of the issue: 0.3 M☉ at 4 kpc, source at 8 kpc, u0 = 0.1,
// μ_rel = 10 mas/yr (t_E ≈ 20 d). θ_E from lib/physics (Paczyński 1986 eq. 1), ≈ 0.55 mas.
const BULGE_U0 = 0.1;
const bulge = pointLens(0.3, 4000, 8000, BULGE_U0, 10);
const bulgeTEDays = bulge.einsteinTimeS! / DAY_S;
/** A 183-night cycle from 2027-03-01 with the bulge up on nights 20–160 (a southern winter season). */
const bulgeSchedule = nightlySchedule({ nights: 183, seasonFirstNight: 20, seasonLastNight: 160, cadenceHours: 2 });
/** t0 at 04:00 UTC on night 90, inside that night's window. */
const bulgePeakJd = CYCLE_START_JD + 90 + 4 / 24;

function bulgeInputs(overrides: Partial<ScienceCaseInputs> = {}, event: Partial<ScienceCaseInputs["event"]> = {}): ScienceCaseInputs {
  return {
    solution: bulge,
    event: { peakJdUtc: bulgePeakJd, impactParameterThetaE: BULGE_U0, sourceRadiusThetaE: null, limbDarkeningU: 0, ...event },
    instrument: { ...noInstrument, psfFwhmMas: 100 },
    schedule: bulgeSchedule,
    campaign: { lengthDays: 120, cadenceHours: 2 },
    photonBudget: { notApplicable: true },
    orbit: noOrbit,
    ...overrides,
  };
}

function answer(answers: CaseAnswer[], id: CaseQuestionId): CaseAnswer {
  const found = answers.find((a) => a.id === id);
  if (found === undefined) throw new Error(`no answer ${id} among ${answers.map((a) => a.id).join(", ")}`);
  return found;
}

describe("science case list", () => {
  it("holds the six cases once, each with a label in the trade's words", () => {
    expect(scienceCaseIds).toEqual(["photometric-microlensing", "astrometric-microlensing", "resolved-images", "time-delay", "horizon-scale", "relativistic-orbit"]);
    expect(Object.keys(scienceCaseLabels).sort()).toEqual([...scienceCaseIds].sort());
    expect(scienceCaseLabels["photometric-microlensing"]).toBe("Photometric microlensing event");
    expect(scienceCaseLabels["horizon-scale"]).toBe("Horizon-scale imaging");
    expect(scienceCaseLabels["relativistic-orbit"]).toBe("Relativistic orbit");
  });
});

describe("each case asks only its own questions", () => {
  const questions: Record<ScienceCaseId, CaseQuestionId[]> = {
    "photometric-microlensing": ["peak-magnification", "event-visits", "peak-visits", "peak-window", "event-duration"],
    "astrometric-microlensing": ["astrometric-shift", "astrometric-detection"],
    "resolved-images": ["image-separation", "flux-ratio"],
    "time-delay": ["delay-season", "delay-visits", "delay-cadence", "seasons-covered"],
    "horizon-scale": ["shadow", "photon-ring"],
    "relativistic-orbit": ["periapsis-season", "periapsis-epochs", "precession-signal", "redshift-signal"],
  };
  for (const caseId of scienceCaseIds) {
    it(`${caseId}: ${questions[caseId].join(", ")}`, () => {
      const answers = scienceCaseQuestions(caseId, bulgeInputs());
      expect(answers.map((a) => a.id)).toEqual(questions[caseId]);
      for (const a of answers) {
        expect(a.sentence).toMatch(/^[A-Z].*[.]$/);
        expect(a.source.length).toBeGreaterThan(5);
      }
    });
  }

  it("no photometric question is about resolution or delay, and no resolved-images question about a delay", () => {
    const photometric = scienceCaseQuestions("photometric-microlensing", bulgeInputs()).map((a) => a.id);
    expect(photometric).not.toContain("image-separation");
    expect(photometric.some((id) => id.startsWith("delay"))).toBe(false);
    const resolved = scienceCaseQuestions("resolved-images", bulgeInputs()).map((a) => a.id);
    expect(resolved.some((id) => id.startsWith("delay") || id === "shadow")).toBe(false);
  });
});

describe("the textbook bulge event (0.3 M☉ at 4 kpc, source 8 kpc, u0 = 0.1)", () => {
  it("has θ_E ≈ 0.55 mas (lib/physics einsteinRadius, Paczyński 1986)", () => {
    expect(bulge.einsteinRadiusRad / MILLIARCSECOND_RAD).toBeCloseTo(0.55, 2);
  });

  it("defaults to a photometric event and gets no 'Not feasible' for resolution or delay", () => {
    const chosen = defaultScienceCase(bulge, { ...noInstrument, psfFwhmMas: 100 }, noOrbit);
    expect(chosen.caseId).toBe("photometric-microlensing");
    expect(chosen.reason).toBe(
      "A compact lens whose two images, 1.11 mas apart, blend within the PSF FWHM of 100 mas, with t_E = 20.2 d: one watches the source brighten and fade, a photometric microlensing event.",
    );
    const answers = scienceCaseQuestions(chosen.caseId, bulgeInputs());
    expect(answers.filter((a) => a.verdict === "infeasible")).toEqual([]);
    expect(answers.some((a) => /resol|delay/i.test(a.question))).toBe(false);
  });

  it("peaks at A(0.1) = 10.04 for a point source (Paczyński 1986 eq. 6)", () => {
    const peak = answer(scienceCaseQuestions("photometric-microlensing", bulgeInputs()), "peak-magnification");
    expect(peak.verdict).toBe("feasible");
    expect(peak.figure).toBe("A = 10 at u0 = 0.1 (point source)");
    expect(peak.sentence).toContain("set the source's radius ρ to include the finite-source limit");
    expect(pointLensMagnification(0.1)).toBeCloseTo(10.037, 3);
  });

  it("states the finite-source peak beside the point-source one when ρ is set (Witt & Mao 1994)", () => {
    const peak = answer(scienceCaseQuestions("photometric-microlensing", bulgeInputs({}, { sourceRadiusThetaE: 0.2 })), "peak-magnification");
    expect(peak.sentence).toContain("against 10 for a point source");
    expect(peak.sentence).toContain("ρ > u0");
    // A uniform disk of ρ = 0.2 centred within it peaks near 2/ρ·√(1 + ρ²/4)... lower than the point source's 10.
    expect(Number(peak.figure.slice(4, peak.figure.indexOf(" at")))).toBeLessThan(10);
  });

  it("counts the visits over t0 ± t_E and over the peak from the schedule", () => {
    const answers = scienceCaseQuestions("photometric-microlensing", bulgeInputs());
    const event = answer(answers, "event-visits");
    // 2 t_E ≈ 40 nights, three visits a night (01:00, 03:00, 05:00 UTC at 2 h cadence).
    const nights = Math.floor(2 * bulgeTEDays);
    expect(event.verdict).toBe("feasible");
    expect(Number(event.figure.split(" ")[0])).toBeGreaterThanOrEqual(3 * nights);
    const peak = answer(answers, "peak-visits");
    expect(peak.sentence).toContain("u0·t_E");
    expect(answer(answers, "peak-window")).toMatchObject({ verdict: "feasible", sentence: expect.stringContaining("falls in a usable window") });
    expect(answer(answers, "event-duration").verdict).toBe("feasible");
  });
});

describe("missing inputs are named in words (issue 16, item 8)", () => {
  it("asks for the peak date to count the visits around the peak", () => {
    const answers = scienceCaseQuestions("photometric-microlensing", bulgeInputs({}, { peakJdUtc: null }));
    expect(answer(answers, "peak-visits")).toMatchObject({ verdict: "unknown", sentence: "Set the event's peak date (t0) to count the visits around the peak." });
    expect(answer(answers, "event-visits").sentence).toMatch(/^Set the event's peak date \(t0\)/);
    // The peak magnification needs no date.
    expect(answer(answers, "peak-magnification").verdict).toBe("feasible");
  });

  it("asks for the site and cycle when there is no schedule", () => {
    const answers = scienceCaseQuestions("photometric-microlensing", bulgeInputs({ schedule: null }));
    expect(answer(answers, "event-visits")).toMatchObject({ verdict: "unknown", sentence: "Set the observing site and the cycle's first and last nights to simulate the nights and count the visits." });
  });

  it("asks for the relative proper motion when t_E is unknown", () => {
    const answers = scienceCaseQuestions("photometric-microlensing", bulgeInputs({ solution: { ...bulge, einsteinTimeS: null } }));
    expect(answer(answers, "event-duration").sentence).toMatch(/^Set the relative proper motion, or apply a light-curve fit, to get the event's timescale t_E/);
  });

  it("asks for the impact parameter, and for ρ when a point source passes exactly behind the lens", () => {
    expect(answer(scienceCaseQuestions("photometric-microlensing", bulgeInputs({}, { impactParameterThetaE: null })), "peak-magnification").sentence).toMatch(/^Set the event's impact parameter u0/);
    expect(answer(scienceCaseQuestions("photometric-microlensing", bulgeInputs({}, { impactParameterThetaE: 0 })), "peak-magnification").sentence).toMatch(/set the source's radius ρ/);
  });

  it("asks for the astrometric precision, the contrast and the interferometer", () => {
    expect(answer(scienceCaseQuestions("astrometric-microlensing", bulgeInputs()), "astrometric-shift").sentence).toMatch(/Set the astrometric precision per epoch/);
    expect(answer(scienceCaseQuestions("resolved-images", bulgeInputs()), "flux-ratio").sentence).toMatch(/Set the contrast the instrument reaches/);
    const horizon = scienceCaseQuestions("horizon-scale", bulgeInputs());
    expect(answer(horizon, "shadow")).toMatchObject({ verdict: "unknown", sentence: expect.stringContaining("Set the interferometer's wavelength and longest baseline") });
  });
});

describe("the schedule's reasons", () => {
  it("names the season gap when the peak falls while the target is behind the Sun", () => {
    // t0 on night 175: after the season (nights 20–160), the bulge behind the Sun.
    const answers = scienceCaseQuestions("photometric-microlensing", bulgeInputs({}, { peakJdUtc: CYCLE_START_JD + 175 }));
    const window = answer(answers, "peak-window");
    expect(window.verdict).toBe("infeasible");
    expect(window.sentence).toContain("falls in the season gap: at that time of year the target is not up in darkness, being too close to the Sun in the sky");
    expect(window.sentence).toContain("the peak is not observed");
    expect(answer(answers, "peak-visits")).toMatchObject({ verdict: "infeasible", figure: expect.stringMatching(/^0 visits/) });
  });

  it("a peak in daylight between two nights is observed when the nights lie within t_eff/4 (our rule)", () => {
    // Noon UTC of night 90: 5 h after the window ends; t_eff = u0 t_E ≈ 2 d.
    const window = answer(scienceCaseQuestions("photometric-microlensing", bulgeInputs({}, { peakJdUtc: CYCLE_START_JD + 90.5 })), "peak-window");
    expect(window.verdict).toBe("feasible");
    expect(window.sentence).toContain("in daylight");
  });

  const reasons: [EmptyScheduleReason, RegExp][] = [
    ["never-up", /never rises above the altitude limit/],
    ["always-daylight", /only in daylight or twilight/],
    ["behind-sun", /behind the Sun/],
    ["moon", /Moon constraint/],
    ["windows-too-short", /shorter than one visit/],
    ["weather", /lost to the clear-night fraction/],
  ];
  for (const [reason, words] of reasons) {
    it(`an empty schedule (${reason}) says why in the sampling questions`, () => {
      const empty = nightlySchedule({ nights: 183, seasonFirstNight: 0, seasonLastNight: 0, emptyReason: reason });
      const answers = scienceCaseQuestions("photometric-microlensing", bulgeInputs({ schedule: empty }));
      for (const id of ["event-visits", "peak-visits", "peak-window"] as const) {
        expect(answer(answers, id)).toMatchObject({ verdict: "infeasible", sentence: expect.stringMatching(words) });
      }
      expect(answer(answers, "event-visits").sentence).toMatch(/^No visit can be planned: /);
    });
  }
});

describe("time-delay monitoring", () => {
  const sisInputs = (delayDays: number, overrides: Partial<ScienceCaseInputs> = {}) => bulgeInputs({ solution: isothermalSphere(250, 0.4, delayDays), ...overrides });

  it("flags a delay longer than the target's season (common practice: the delay within one season)", () => {
    // The season runs from 01:00 UTC of night 20 to 07:00 UTC of night 160: 140.25 d.
    const season = answer(scienceCaseQuestions("time-delay", sisInputs(200)), "delay-season");
    expect(season.verdict).toBe("infeasible");
    expect(season.sentence).toBe(
      "The delay Δt = 200 d is longer than the target's longest observing season at this site (140 d within the cycle): a variation seen in one image reaches the other while the target cannot be observed.",
    );
  });

  it("a delay that fits with little room is marginal, one that fits 1.5 times feasible", () => {
    expect(answer(scienceCaseQuestions("time-delay", sisInputs(120)), "delay-season")).toMatchObject({ verdict: "marginal", sentence: expect.stringContaining("only 20.3 d of each image's light curve overlaps") });
    expect(answer(scienceCaseQuestions("time-delay", sisInputs(40)), "delay-season").verdict).toBe("feasible");
  });

  it("counts the visits per Δt within the seasons, and compares Δt with the cadence", () => {
    // One visit a night (24 h cadence) over 141 nights: 141 visits over 140 d, about 2.0 per 2-day delay.
    const daily = nightlySchedule({ nights: 183, seasonFirstNight: 20, seasonLastNight: 160, cadenceHours: 24 });
    const answers = scienceCaseQuestions("time-delay", sisInputs(2, { schedule: daily, campaign: { lengthDays: 120, cadenceHours: 24 } }));
    expect(answer(answers, "delay-visits")).toMatchObject({ verdict: "infeasible", figure: "2.01 visits per Δt (2 d)" });
    expect(answer(answers, "delay-cadence")).toMatchObject({ verdict: "marginal", sentence: expect.stringContaining("is 2 times the 1 d cadence") });
    const short = answer(scienceCaseQuestions("time-delay", sisInputs(0.5, { campaign: { lengthDays: 120, cadenceHours: 24 } })), "delay-cadence");
    expect(short).toMatchObject({ verdict: "infeasible", sentence: expect.stringContaining("shorter than the spacing of the visits") });
    expect(answer(answers, "seasons-covered")).toMatchObject({ verdict: "feasible", sentence: "The cycle covers 1 observing season of the target (2027-03-21 to 2027-08-08)." });
  });

  it("a single image has no delay to measure", () => {
    const single = { ...isothermalSphere(250, 0.4, 40), imageSeparationRad: null, fluxRatio: null, timeDelayS: null };
    expect(answer(scienceCaseQuestions("time-delay", bulgeInputs({ solution: single })), "delay-season")).toMatchObject({ verdict: "infeasible", figure: "one image" });
  });
});

describe("horizon-scale imaging", () => {
  // Sgr A*: 4.1 × 10⁶ M☉ at 8.1 kpc; shadow 2√27 GM/(c² D) ≈ 51.9 µas (lib/physics shadowAngularDiameter).
  const sgrA = pointLens(4.1e6, 8100, 1e9, 1, null);

  it("a shadow below half of λ/B is infeasible (common practice)", () => {
    // λ/B at 1.3 mm over 1000 km is 268 µas.
    const answers = scienceCaseQuestions("horizon-scale", bulgeInputs({ solution: sgrA, instrument: { ...noInstrument, interferometer: { wavelengthMm: 1.3, longestBaselineKm: 1000 } } }));
    expect(answer(answers, "shadow")).toMatchObject({ verdict: "infeasible", figure: "51.9 µas = 0.194 × λ/B (268 µas)" });
    expect(answer(answers, "photon-ring").verdict).toBe("infeasible");
  });

  it("the shadow against the EHT's λ/B is feasible, and the photon ring is reported beside it", () => {
    const answers = scienceCaseQuestions("horizon-scale", bulgeInputs({ solution: sgrA, instrument: { ...noInstrument, interferometer: { wavelengthMm: 1.3, longestBaselineKm: 10_700 } } }));
    expect(answer(answers, "shadow")).toMatchObject({ verdict: "feasible", sentence: "The shadow is 51.9 µas across, 2.07 times λ/B = 25.1 µas (1.3 mm over 10700 km): its edge is resolved and the shadow can be imaged." });
    expect(answer(answers, "photon-ring").sentence).toMatch(/^The first relativistic Einstein ring \(n = 1\) is 52 µas across, 1\.0014 times the shadow's/);
  });

  it("an extended lens has no shadow", () => {
    expect(answer(scienceCaseQuestions("horizon-scale", bulgeInputs({ solution: isothermalSphere(250, 0.4, 40) })), "shadow")).toMatchObject({ verdict: "infeasible", figure: "no shadow" });
  });
});

describe("resolved multiple images", () => {
  const sis = isothermalSphere(250, 0.4, 40);

  it("grades the separation against the PSF FWHM, else λ/B (our rule), and the flux ratio against the contrast", () => {
    const answers = scienceCaseQuestions("resolved-images", bulgeInputs({ solution: sis, instrument: { ...noInstrument, psfFwhmMas: 100, reachableContrast: 2 } }));
    // θ_E = 4π(σ/c)² D_LS/D_S = 0.901″ for 250 km/s and D_LS/D_S = 0.5; separation 2 θ_E (SIS, u < 1).
    expect(answer(answers, "image-separation")).toMatchObject({ verdict: "feasible", figure: "1.8″ = 18 × PSF FWHM (100 mas)" });
    // Flux ratio (1 + u)/(1 − u) = 2.33 at u = 0.4, against a contrast of 2: 0.857 of it, marginal.
    expect(answer(answers, "flux-ratio")).toMatchObject({ verdict: "marginal", figure: "flux ratio 2.33 (Δm = 0.92 mag) against a contrast of 2" });
    const interferometric = scienceCaseQuestions("resolved-images", bulgeInputs({ instrument: { ...noInstrument, interferometer: { wavelengthMm: 1.3, longestBaselineKm: 10_700 } } }));
    expect(answer(interferometric, "image-separation").figure).toMatch(/× λ\/B \(25\.1 µas\)$/);
  });
});

describe("astrometric microlensing", () => {
  it("dates the largest shift at t0 ∓ t_E √(2 − u0²) (u(t) = √2; Paczyński 1986 trajectory)", () => {
    const shift = answer(scienceCaseQuestions("astrometric-microlensing", bulgeInputs({ instrument: { ...noInstrument, astrometricPrecisionMas: 0.1 } }, { impactParameterThetaE: 0.5 })), "astrometric-shift");
    const offsetDays = bulgeTEDays * Math.sqrt(2 - 0.25);
    expect(shift.sentence).toContain(`t0 ∓ ${Number(offsetDays.toPrecision(3))} d`);
    // θ_E/√8 = 0.195 mas against 0.1 mas: above one precision, below three.
    expect(shift).toMatchObject({ verdict: "marginal", figure: "195 µas = 1.95 × the precision per epoch (100 µas)" });
  });

  it("beyond u0 = √2 the largest shift is at t0, θ_E u0/(u0² + 2)", () => {
    const shift = answer(scienceCaseQuestions("astrometric-microlensing", bulgeInputs({ instrument: { ...noInstrument, astrometricPrecisionMas: 0.1 } }, { impactParameterThetaE: 3 })), "astrometric-shift");
    // θ_E × 3/11 = 0.554 mas × 0.273 = 0.151 mas.
    expect((bulge.einsteinRadiusRad * 3) / 11 / MICROARCSECOND_RAD).toBeCloseTo(151, 0);
    expect(shift.figure).toBe("151 µas = 1.51 × the precision per epoch (100 µas)");
    expect(shift.sentence).toContain("largest at closest approach");
  });

  it("combines the visits near the largest shift: none near it is infeasible", () => {
    // The whole event in the season gap: t0 on night 175, t_E ≈ 20 d; the season ends on night 160.
    const inputs = bulgeInputs({ instrument: { ...noInstrument, astrometricPrecisionMas: 0.1 } }, { peakJdUtc: CYCLE_START_JD + 400 });
    expect(answer(scienceCaseQuestions("astrometric-microlensing", inputs), "astrometric-detection")).toMatchObject({ verdict: "infeasible", figure: "0σ over 0 visits" });
    const inSeason = answer(scienceCaseQuestions("astrometric-microlensing", bulgeInputs({ instrument: { ...noInstrument, astrometricPrecisionMas: 0.1 } })), "astrometric-detection");
    expect(inSeason.verdict).toBe("feasible");
  });
});

describe("the default science case (our rule)", () => {
  it("horizon-scale for a shadow of at least half λ/B", () => {
    const sgrA = pointLens(4.1e6, 8100, 1e9, 1, null);
    const chosen = defaultScienceCase(sgrA, { ...noInstrument, psfFwhmMas: 100, interferometer: { wavelengthMm: 1.3, longestBaselineKm: 10_700 } }, noOrbit);
    expect(chosen).toEqual({
      caseId: "horizon-scale",
      reason: "The lens's shadow is 51.9 µas across, at least half of the interferometer's λ/B of 25.1 µas, so the shadow itself can be observed: horizon-scale imaging.",
    });
    // Without an interferometer its images (θ_E ≈ 2″ for a distant source) are resolved by a 100 mas PSF.
    expect(defaultScienceCase(sgrA, { ...noInstrument, psfFwhmMas: 100 }, noOrbit).caseId).toBe("resolved-images");
  });

  it("resolved images for an SIS wider than the resolution, time-delay monitoring when narrower", () => {
    const sis = isothermalSphere(250, 0.4, 40);
    expect(defaultScienceCase(sis, { ...noInstrument, psfFwhmMas: 100 }, noOrbit).caseId).toBe("resolved-images");
    expect(defaultScienceCase(sis, { ...noInstrument, psfFwhmMas: 3000 }, noOrbit)).toEqual({
      caseId: "time-delay",
      reason: "An extended lens whose images arrive 40 d apart and lie closer together than the PSF FWHM of 3″: the question is whether the delay can be measured, time-delay monitoring.",
    });
  });

  it("astrometric for a nearby lens seen at u ≥ 1 with a shift above the precision per epoch", () => {
    const nearby = pointLens(0.6, 10, 2000, 3, 1000);
    expect(defaultScienceCase(nearby, { ...noInstrument, psfFwhmMas: 100, astrometricPrecisionMas: 0.1 }, noOrbit).caseId).toBe("astrometric-microlensing");
    expect(defaultScienceCase(nearby, { ...noInstrument, psfFwhmMas: 100 }, noOrbit).caseId).toBe("photometric-microlensing");
  });
});

describe("with the simulated schedule of a southern site (lib/schedule)", () => {
  it("a bulge event peaking in June (southern winter) collects visits over its peak", () => {
    const schedule = observingSchedule({ ...bulgeSeason, site: southSite, target: bulgeField });
    const answers = scienceCaseQuestions("photometric-microlensing", bulgeInputs({ schedule }, { peakJdUtc: jd("2022-06-15T04:00:00Z") }));
    expect(answer(answers, "peak-window").verdict).toBe("feasible");
    expect(answer(answers, "peak-visits").verdict).toBe("feasible");
    expect(answer(answers, "event-visits").verdict).toBe("feasible");
  });

  it("the same event peaking when the Galactic centre is behind the Sun (December) collects nothing and says why", () => {
    const schedule = observingSchedule({ ...bulgeSeason, site: southSite, target: bulgeField, cycleStartNightIso: "2022-09-01", cycleEndNightIso: "2023-02-28" });
    const answers = scienceCaseQuestions("photometric-microlensing", bulgeInputs({ schedule }, { peakJdUtc: jd("2022-12-20T04:00:00Z") }));
    const window = answer(answers, "peak-window");
    expect(window.verdict).toBe("infeasible");
    expect(window.sentence).toMatch(/^The peak \(t0 = 2022-12-20 04:00 UTC\) falls in the season gap: at that time of year the target is not up in darkness/);
    expect(answer(answers, "peak-visits")).toMatchObject({ verdict: "infeasible", figure: expect.stringMatching(/^0 visits/) });
  });
});
