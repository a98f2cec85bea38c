import { defaultPhotometrySettings } from "@/lib/workspace/photometry-schema";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { lensModel as lensModelEnum } from "@/db/schema";
import { lensModels as sketchLensModels } from "@/lib/bench/sketch-state";
import { lensModelIds, lensModelLabels, lensModelOf, lensModelOfAlias, lensModelOfParameters, lensModels, solveLens, type LensGeometry } from "@/lib/lensing";
import { angularDiameterDistance, angularDiameterDistanceBetween, ARCSECOND_RAD, DAY_S, GM_SUN_M3_PER_S2, JULIAN_YEAR_S, MICROARCSECOND_RAD, MILLIARCSECOND_RAD, PARSEC_M, SPEED_OF_LIGHT_M_PER_S } from "@/lib/physics";
import { deriveTargetColumns, type FeasibilitySettings } from "@/lib/workspace/derived";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";
import { lensModelLabels as targetLensModelLabels, lensModels as targetLensModels, targetFieldsSchema, type LensHypothesis } from "@/lib/workspace/target-schema";

// mpmath findroot on the Virbhadra–Ellis exact lens equation at 40 digits (tests/fixtures/generate_physics.py, photon-ring).
const photonRing: { rows: { massSolar: number; dLensPc: number; dSourcePc: number; ringDiameterRad: string; shadowDiameterRad: string }[] } = JSON.parse(
  readFileSync(fileURLToPath(new URL("../../fixtures/physics/photon-ring.json", import.meta.url)), "utf8"),
);

const galactic: LensGeometry = { dLensPc: 4000, dSourcePc: 8000, dLensSourcePc: 4000, zLens: 0 };
const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected);
const point = (lensMassSolar: number, u: number, geometry = galactic, properMotionRadPerS: number | null = null) =>
  lensModelOf("point").solve({ parameters: { lensMassSolar }, geometry, sourceOffsetThetaE: u, properMotionRadPerS });
const sis = (velocityDispersionKmPerS: number, u: number, geometry: LensGeometry) =>
  lensModelOf("sis").solve({ parameters: { velocityDispersionKmPerS }, geometry, sourceOffsetThetaE: u, properMotionRadPerS: null });

describe("the point-mass model", () => {
  it("gives Paczyński's images and magnifications (B. Paczyński 1986, ApJ 304, 1)", () => {
    for (const u of [0.1, 0.5, 1, 3]) {
      const s = point(0.3, u);
      const root = Math.sqrt(u * u + 4);
      expect(s.images[0].positionThetaE).toBeCloseTo((u + root) / 2, 14);
      expect(s.images[1].positionThetaE).toBeCloseTo((u - root) / 2, 14);
      expect(relative(s.magnificationTotal, (u * u + 2) / (u * root))).toBeLessThan(1e-14);
      expect(relative(s.images[0].magnification, (u * u + 2) / (2 * u * root) + 0.5)).toBeLessThan(1e-14);
      expect(relative(s.fluxRatio!, ((u * u + 2) / (2 * u * root) + 0.5) / ((u * u + 2) / (2 * u * root) - 0.5))).toBeLessThan(1e-13);
      expect(relative(s.imageSeparationRad!, root * s.einsteinRadiusRad)).toBeLessThan(1e-14);
    }
    // A(1) = 3/√5 ≈ 1.342, the classic threshold of an event (Paczyński 1986)
    expect(point(0.3, 1).magnificationTotal).toBeCloseTo(3 / Math.sqrt(5), 14);
  });

  it("has θ_E = √(4GM/c² · D_LS/(D_L D_S)): about 1 mas for 1 M☉ at 4 kpc before a source at 8 kpc (Paczyński 1986, eq. 1; the order of magnitude from memory)", () => {
    const expected = Math.sqrt(((4 * GM_SUN_M3_PER_S2) / SPEED_OF_LIGHT_M_PER_S ** 2) * (4000 / (4000 * 8000 * PARSEC_M)));
    const s = point(1, 0.3);
    expect(relative(s.einsteinRadiusRad, expected)).toBeLessThan(1e-14);
    expect(s.einsteinRadiusRad / MILLIARCSECOND_RAD).toBeCloseTo(1.01, 2);
  });

  it("gives the largest astrometric shift θ_E/√8 (C. M. Walker 1995, ApJ 453, 37; from memory) and the shift u/(u²+2) θ_E at u", () => {
    const s = point(0.3, 0.5);
    expect(relative(s.maxAstrometricShiftRad!, s.einsteinRadiusRad / Math.sqrt(8))).toBeLessThan(1e-15);
    expect(relative(s.centroidShiftRad!, (0.5 / 2.25) * s.einsteinRadiusRad)).toBeLessThan(1e-15);
  });

  it("gives t_E = θ_E/μ_rel and the microlens parallax π_rel/θ_E for Galactic distances only (Gould 2000, ApJ 542, 785)", () => {
    const muRadPerS = (5 * MILLIARCSECOND_RAD) / JULIAN_YEAR_S;
    const s = point(0.3, 0.1, galactic, muRadPerS);
    expect(relative(s.einsteinTimeS!, s.einsteinRadiusRad / muRadPerS)).toBeLessThan(1e-15);
    const relativeParallaxRad = (1 / 4000 - 1 / 8000) * (ARCSECOND_RAD);
    expect(relative(s.microlensParallax!, relativeParallaxRad / s.einsteinRadiusRad)).toBeLessThan(1e-12);
    expect(point(0.3, 0.1).einsteinTimeS).toBeNull();
    expect(point(1e9, 0.1, { dLensPc: 1e9, dSourcePc: 1.5e9, dLensSourcePc: 7e8, zLens: 0.5 }).microlensParallax).toBeNull();
  });

  it("has the n = 1 relativistic Einstein ring of the exact lens equation as its photon ring, within 1e-12 of mpmath", () => {
    let worst = 0;
    for (const row of photonRing.rows) {
      const s = point(row.massSolar, 0.1, { dLensPc: row.dLensPc, dSourcePc: row.dSourcePc, dLensSourcePc: row.dSourcePc - row.dLensPc, zLens: 0 });
      worst = Math.max(worst, relative(s.photonRingDiameterRad!, Number(row.ringDiameterRad)));
      expect(relative(s.shadowDiameterRad!, Number(row.shadowDiameterRad))).toBeLessThan(1e-12);
      // just outside the shadow: θ_1 ≈ θ_∞ (1 + e^(b̄ − 2π)) with b̄ ≈ −0.40 (V. Bozza 2002, Phys. Rev. D 66, 103001)
      expect(s.photonRingDiameterRad! / s.shadowDiameterRad!).toBeCloseTo(1 + Math.exp(-0.40023 - 2 * Math.PI), 5);
    }
    expect(worst).toBeLessThan(1e-12);
    console.log("photon ring: worst relative error against mpmath", worst);
  });
});

describe("the singular isothermal sphere model", () => {
  const geometry: LensGeometry = { dLensPc: 1e9, dSourcePc: 2e9, dLensSourcePc: 1e9, zLens: 0.3 };

  it("has θ_E = 4π (σ/c)² D_LS/D_S: 0.90″ for 250 km/s at D_LS/D_S = 1/2 (Schneider, Ehlers & Falco 1992, sect. 8.1.4)", () => {
    const s = sis(250, 0.3, geometry);
    expect(relative(s.einsteinRadiusRad, 4 * Math.PI * (250e3 / SPEED_OF_LIGHT_M_PER_S) ** 2 * 0.5)).toBeLessThan(1e-14);
    expect(s.einsteinRadiusRad / ARCSECOND_RAD).toBeCloseTo(0.901, 3);
  });

  it("forms two images at (u ± 1) θ_E with μ = 1 ± 1/u inside the Einstein radius, and the delay 2 (1+z_L)(D_L D_S/D_LS) β θ_E / c", () => {
    const u = 0.3;
    const s = sis(250, u, geometry);
    expect(s.images.map((i) => i.positionThetaE)).toEqual([expect.closeTo(1.3, 14), expect.closeTo(-0.7, 14)]);
    expect(s.images[0].magnification).toBeCloseTo(1 + 1 / u, 13);
    expect(s.images[1].magnification).toBeCloseTo(1 - 1 / u, 13);
    expect(relative(s.fluxRatio!, (1 + u) / (1 - u))).toBeLessThan(1e-14);
    expect(relative(s.imageSeparationRad!, 2 * s.einsteinRadiusRad)).toBeLessThan(1e-14);
    const delayS = (2 * 1.3 * ((1e9 * 2e9) / 1e9) * PARSEC_M * u * s.einsteinRadiusRad ** 2) / SPEED_OF_LIGHT_M_PER_S;
    expect(relative(s.timeDelayS!, delayS)).toBeLessThan(1e-14);
  });

  it("forms one image for u ≥ 1: no separation, flux ratio or delay; never a shadow, photon ring or astrometric shift", () => {
    const s = sis(250, 1.5, geometry);
    expect(s.images).toHaveLength(1);
    expect(s.magnificationTotal).toBeCloseTo(1 + 1 / 1.5, 14);
    for (const value of [s.imageSeparationRad, s.fluxRatio, s.timeDelayS, s.shadowDiameterRad, s.photonRingDiameterRad, s.maxAstrometricShiftRad, s.centroidShiftRad]) {
      expect(value).toBeNull();
    }
  });
});

describe("the registry is the one list of lens models", () => {
  it("gives the database enum, the target and bench schemas and the labels their values", () => {
    expect(lensModelIds).toEqual(["point", "sis"]);
    expect(lensModelEnum.enumValues).toEqual(lensModelIds);
    expect(targetLensModels).toEqual(lensModelIds);
    expect(sketchLensModels).toEqual(lensModelIds);
    expect(targetFieldsSchema.shape.lensModel.options).toEqual(lensModelIds);
    expect(lensModels.map((m) => m.id)).toEqual(lensModelIds);
    expect(lensModelLabels).toEqual({ point: "Point mass", sis: "Singular isothermal sphere" });
    expect(targetLensModelLabels).toEqual(lensModelLabels);
  });

  it("reads the import's spellings and infers a model from its parameter alone", () => {
    expect(lensModelOfAlias("Point-Mass")).toBe("point");
    expect(lensModelOfAlias("Singular Isothermal Sphere")).toBe("sis");
    expect(lensModelOfAlias("NFW")).toBeUndefined();
    expect(lensModelOfParameters({ lensMassSolar: 1 })).toBe("point");
    expect(lensModelOfParameters({ velocityDispersionKmPerS: 200 })).toBe("sis");
    expect(lensModelOfParameters({ lensMassSolar: 1, velocityDispersionKmPerS: 200 })).toBeUndefined();
  });
});

describe("the stored columns are the model's solution", () => {
  const settings: FeasibilitySettings = {
    site: { name: "S", latitudeDeg: -30, longitudeDeg: -70, elevationM: 2000, horizonLimitDeg: 20 },
    instrument: instrumentSchema.parse({ resolutionMas: 1, cadenceHours: 24, campaignLengthDays: 90 }),
    photometry: defaultPhotometrySettings,
    cycleStartDate: null,
    cycleEndDate: null,
  };
  const base = { lensMassSolar: null, velocityDispersionKmPerS: null, lensDistancePc: null, sourceDistancePc: null, lensRedshift: null, sourceRedshift: null, properMotionMasPerYr: 5 };
  const hypotheses: LensHypothesis[] = [
    { ...base, lensModel: "point", lensMassSolar: 0.3, lensDistancePc: 4000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.1 },
    { ...base, lensModel: "point", lensMassSolar: 4.3e6, lensDistancePc: 8300, sourceDistancePc: 16600, sourceOffsetThetaE: 2 },
    { ...base, lensModel: "sis", velocityDispersionKmPerS: 250, lensRedshift: 0.3, sourceRedshift: 2, sourceOffsetThetaE: 0.4 },
    { ...base, lensModel: "sis", velocityDispersionKmPerS: 250, lensRedshift: 0.3, sourceRedshift: 2, sourceOffsetThetaE: 1.2 },
  ];

  it("writes θ_E, separation, magnification, delay, t_E and shadow exactly as solve gives them", () => {
    for (const h of hypotheses) {
      const columns = deriveTargetColumns(h, settings, null);
      const geometry: LensGeometry =
        h.lensRedshift == null
          ? { dLensPc: h.lensDistancePc!, dSourcePc: h.sourceDistancePc!, dLensSourcePc: h.sourceDistancePc! - h.lensDistancePc!, zLens: 0 }
          : // the physics module's default flat ΛCDM, as deriveTargetColumns uses it
            {
              dLensPc: angularDiameterDistance(h.lensRedshift),
              dSourcePc: angularDiameterDistance(h.sourceRedshift!),
              dLensSourcePc: angularDiameterDistanceBetween(h.lensRedshift, h.sourceRedshift!),
              zLens: h.lensRedshift,
            };
      const s = solveLens(h.lensModel, h, geometry, h.sourceOffsetThetaE, (5 * MILLIARCSECOND_RAD) / JULIAN_YEAR_S)!;
      expect(columns.einsteinRadiusMas).toBe(s.einsteinRadiusRad / MILLIARCSECOND_RAD);
      expect(columns.imageSeparationMas).toBe(s.imageSeparationRad === null ? null : s.imageSeparationRad / MILLIARCSECOND_RAD);
      expect(columns.magnificationTotal).toBe(s.magnificationTotal);
      expect(columns.timeDelayDays).toBe(s.timeDelayS === null ? null : s.timeDelayS / DAY_S);
      expect(columns.crossingTimeDays).toBe(s.einsteinTimeS! / DAY_S);
      expect(columns.shadowDiameterMicroarcsec).toBe(s.shadowDiameterRad === null ? null : s.shadowDiameterRad / MICROARCSECOND_RAD);
    }
  });
});
