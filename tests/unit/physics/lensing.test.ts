import { describe, expect, it } from "vitest";
import { ARCSECOND_RAD, DAY_S, JULIAN_YEAR_S, MICROARCSECOND_RAD, SOLAR_RADIUS_M, AU_M } from "@/lib/physics/constants";
import { angularDiameterDistance, angularDiameterDistanceBetween, comovingDistance } from "@/lib/physics/cosmology";
import {
  einsteinCrossingTime,
  einsteinRadius,
  paczynskiMagnification,
  pointLensImages,
  pointLensMagnification,
  pointMassTimeDelay,
} from "@/lib/physics/point-lens";
import {
  advanceFromMassOverP,
  exactPeriastronAdvance,
  periastronAdvance,
  shadowAngularDiameter,
  shapiroDelay,
} from "@/lib/physics/relativistic-effects";
import { sisEinsteinRadius, sisImages, sisTimeDelay } from "@/lib/physics/sis";
import { loadFixture, relativeError } from "./fixtures";

interface CosmologyFixture {
  rows: { H0: number; Om0: number; z1: number; z2: number; dAPc: number; dAPcMpmath: string }[];
  mpmathCheck: { H0: number; Om0: number; z: number; dAPc: string };
}
const cosmology = loadFixture<CosmologyFixture>("cosmology.json");
const periastron = loadFixture<{ rows: { pOverM: number; e: number; advance: string }[] }>("periastron.json");

describe("point lens", () => {
  it("gives mu = 3/sqrt(5) at u = 1", () => {
    // Paczynski 1986, ApJ 304, 1, eq. 6: A(1) = 3/sqrt(5) = 1.3416
    expect(relativeError(pointLensMagnification(1), 3 / Math.sqrt(5))).toBeLessThan(2 * Number.EPSILON);
  });

  it("has images (u +- sqrt(u^2+4))/2 with the published magnifications and centroid shift", () => {
    // Paczynski 1986 for theta and mu; Miyamoto & Yoshii 1995, AJ 110, 1427 for u/(u^2+2)
    const images = pointLensImages(0.5);
    const s = Math.sqrt(4.25);
    expect(images.thetaPlus).toBeCloseTo((0.5 + s) / 2, 15);
    expect(images.thetaMinus).toBeCloseTo((0.5 - s) / 2, 15);
    expect(images.magnificationPlus).toBeCloseTo(2.25 / (2 * 0.5 * s) + 0.5, 13);
    expect(images.magnificationMinus).toBeCloseTo(-(2.25 / (2 * 0.5 * s) - 0.5), 13);
    expect(images.magnificationPlus + images.magnificationMinus).toBeCloseTo(1, 14);
    expect(images.centroidShift).toBeCloseTo(0.5 / 2.25, 15);
  });

  it("keeps the faint image accurate for u >> 1 and handles u -> 0", () => {
    // Paczynski 1986: |mu-| -> 1/u^4 as u -> infinity; the ring at u = 0 (common practice)
    expect(relativeError(-pointLensImages(1e4).magnificationMinus, 1e-16)).toBeLessThan(1e-7);
    expect(pointLensImages(0).magnificationTotal).toBe(Infinity);
    expect(pointLensImages(0).thetaPlus).toBe(1);
    expect(pointLensImages(0).centroidShift).toBe(0);
    expect(pointLensImages(Infinity).magnificationTotal).toBe(1);
    expect(() => pointLensImages(NaN)).toThrow(/u must be >= 0/);
    expect(() => pointLensImages(-1)).toThrow(RangeError);
  });

  it("gives a ~1 mas Einstein radius for a solar-mass lens halfway to the bulge", () => {
    // theta_E = sqrt(4GM/c^2 D_LS/(D_L D_S)) (Paczynski 1986): 1 Msun at 4 kpc, source 8 kpc -> 1.01 mas
    const thetaE = einsteinRadius(1, 4000, 8000);
    expect(thetaE / (ARCSECOND_RAD / 1000)).toBeCloseTo(1.009, 3);
    expect(einsteinRadius(1, 4000, 8000, 4000)).toBe(thetaE);
    expect(() => einsteinRadius(1, 8000, 4000)).toThrow(/dLensSourcePc must be > 0/);
    expect(() => einsteinRadius(NaN, 1, 2)).toThrow(/massSolar/);
    expect(() => einsteinRadius(1, Infinity, 2)).toThrow(/dLensPc/);
  });

  it("follows the Paczynski light curve", () => {
    // Paczynski 1986: at t = t0 the magnification is A(u0); one t_E later A(sqrt(u0^2 + 1))
    const tE = 20 * DAY_S;
    expect(paczynskiMagnification(0, 0, tE, 0.1)).toBe(pointLensMagnification(0.1));
    expect(paczynskiMagnification(tE, 0, tE, 1)).toBe(pointLensMagnification(Math.SQRT2));
    // t_E = theta_E / mu_rel: 1 mas at 5 mas/yr is 0.2 yr
    const masPerYr = ARCSECOND_RAD / 1000 / JULIAN_YEAR_S;
    expect(einsteinCrossingTime(ARCSECOND_RAD / 1000, 5 * masPerYr) / JULIAN_YEAR_S).toBeCloseTo(0.2, 14);
    expect(() => einsteinCrossingTime(1, 0)).toThrow(/relativeProperMotionRadPerS/);
  });

  it("gives the point-mass time delay with its small-u limit", () => {
    // Refsdal 1964 closed form; for u -> 0, dt -> 4GM/c^3 (1+z) * 2u (series of u s/2 + 2 asinh(u/2))
    const gmc3 = 1.3271244e20 / 299792458 ** 3;
    expect(relativeError(pointMassTimeDelay(1, 0, 1e-9), 4 * gmc3 * 2e-9)).toBeLessThan(1e-9);
    const u = 1;
    const expected = 4 * gmc3 * 1.5 * ((u * Math.sqrt(5)) / 2 + Math.log((Math.sqrt(5) + 1) / (Math.sqrt(5) - 1)));
    expect(relativeError(pointMassTimeDelay(1, 0.5, u), expected)).toBeLessThan(4 * Number.EPSILON);
    expect(pointMassTimeDelay(1, 0, 0)).toBe(0);
    expect(() => pointMassTimeDelay(1, -1, 1)).toThrow(/zLens/);
  });
});

describe("singular isothermal sphere", () => {
  it("gives theta_E = 4 pi (sigma/c)^2 D_LS/D_S, about 1.15 arcsec at 200 km/s", () => {
    // SIS Einstein radius (Schneider, Ehlers & Falco 1992, sect. 8.1.4): 4 pi (200/299792.458)^2 rad
    // = 1.1536 arcsec (arithmetic by hand); half of it for D_LS/D_S = 1/2
    expect(sisEinsteinRadius(200, 1, 2) / ARCSECOND_RAD).toBeCloseTo(0.5768, 4);
    expect(sisEinsteinRadius(200, 2, 2) / ARCSECOND_RAD).toBeCloseTo(1.1536, 4);
    expect(() => sisEinsteinRadius(200, 3, 2)).toThrow(/dLensSource must be in/);
  });

  it("has images at beta +- theta_E with magnifications 1 +- theta_E/beta", () => {
    // Schneider, Ehlers & Falco 1992, sect. 8.1.4
    const images = sisImages(0.25, 1);
    expect(images).toEqual({ imageCount: 2, thetaPlus: 1.25, thetaMinus: -0.75, magnificationPlus: 5, magnificationMinus: -3, magnificationTotal: 8 });
    const single = sisImages(2, 1);
    expect(single.imageCount).toBe(1);
    expect(single.thetaMinus).toBeNaN();
    expect(single.magnificationPlus).toBe(1.5);
  });

  it("gives the time delay (1+z)/(2c) D_L D_S/D_LS (theta_A^2 - theta_B^2)", () => {
    // physics notes, SIS delay; theta_A = beta + theta_E, theta_B = beta - theta_E
    const [beta, thetaE, z, dL, dS, dLS] = [0.3 * ARCSECOND_RAD, ARCSECOND_RAD, 0.5, 1.2e9, 1.7e9, 0.9e9];
    const pcOverC = (648000 / Math.PI) * AU_M / 299792458;
    const expected = ((1 + z) / 2) * ((dL * dS) / dLS) * pcOverC * ((beta + thetaE) ** 2 - (beta - thetaE) ** 2);
    expect(relativeError(sisTimeDelay(beta, thetaE, z, dL, dS, dLS), expected)).toBeLessThan(1e-13);
    expect(sisTimeDelay(0, thetaE, z, dL, dS, dLS)).toBe(0);
    expect(() => sisTimeDelay(2 * thetaE, thetaE, z, dL, dS, dLS)).toThrow(/betaRad must be in/);
  });
});

describe("flat Lambda-CDM distances", () => {
  it("match mpmath quadrature to 1e-13 and astropy FlatLambdaCDM to 1e-8", () => {
    // fixture from tests/fixtures/generate_physics.py: mpmath quad at 40 digits, and astropy
    // FlatLambdaCDM(Tcmb0=0), whose own integration is good to ~1e-9 (measured here)
    let worstMpmath = 0;
    let worstAstropy = 0;
    for (const row of cosmology.rows) {
      const value = row.z1 === 0
        ? angularDiameterDistance(row.z2, { H0: row.H0, Om0: row.Om0 })
        : angularDiameterDistanceBetween(row.z1, row.z2, { H0: row.H0, Om0: row.Om0 });
      worstMpmath = Math.max(worstMpmath, relativeError(value, Number(row.dAPcMpmath)));
      worstAstropy = Math.max(worstAstropy, relativeError(value, row.dAPc));
    }
    console.info(`angularDiameterDistance: largest relative error ${worstMpmath.toExponential(2)} vs mpmath, ${worstAstropy.toExponential(2)} vs astropy ${cosmology.versions.astropy}`);
    expect(worstMpmath).toBeLessThan(1e-13);
    expect(worstAstropy).toBeLessThan(1e-8);
  });

  it("match 40-digit mpmath quadrature", () => {
    // fixture from tests/fixtures/generate_physics.py, mpmath quad
    const check = cosmology.mpmathCheck;
    expect(relativeError(angularDiameterDistance(check.z, { H0: check.H0, Om0: check.Om0 }), Number(check.dAPc))).toBeLessThan(1e-13);
  });

  it("handle z1 = z2, z = 0 and bad input", () => {
    // Hogg 1999 eq. 19: D_A(z, z) = 0; common practice for the domain
    expect(angularDiameterDistanceBetween(0.7, 0.7)).toBe(0);
    expect(angularDiameterDistance(0)).toBe(0);
    expect(comovingDistance(1, { H0: 70, Om0: 1 })).toBeCloseTo((299792.458 / 70) * 1e6 * 2 * (1 - 1 / Math.SQRT2), 3);
    expect(() => angularDiameterDistanceBetween(1, 0.5)).toThrow(/z2 must be >= z1/);
    expect(() => angularDiameterDistance(NaN)).toThrow(/z must be finite/);
    expect(() => angularDiameterDistance(Infinity)).toThrow(RangeError);
    expect(() => angularDiameterDistance(1, { H0: 0, Om0: 0.3 })).toThrow(/cosmology.H0/);
    expect(() => angularDiameterDistance(1, { H0: 70, Om0: 1.2 })).toThrow(/cosmology.Om0/);
  });
});

describe("relativistic effects", () => {
  it("give the textbook 43 arcsec per century for the innermost planet", () => {
    // Einstein 1915 first-order formula; a = 0.387098 au, e = 0.20563, period 87.969 d (issue 3)
    const perOrbit = periastronAdvance(1, 0.387098, 0.20563);
    const perCentury = (perOrbit * (36525 / 87.969)) / ARCSECOND_RAD;
    expect(perCentury).toBeCloseTo(43.0, 1);
    const exact = exactPeriastronAdvance(1, 0.387098, 0.20563);
    expect(relativeError(exact, perOrbit)).toBeLessThan(1e-6);
    expect(exact).toBeGreaterThan(perOrbit);
  });

  it("match mpmath quadrature of the exact bound-orbit integral", () => {
    // fixture from tests/fixtures/generate_physics.py, mpmath quad
    let worst = 0;
    for (const row of periastron.rows) worst = Math.max(worst, relativeError(advanceFromMassOverP(1 / row.pOverM, row.e), Number(row.advance)));
    console.info(`exactPeriastronAdvance: largest relative error ${worst.toExponential(2)} (mpmath ${periastron.versions.mpmath})`);
    expect(worst).toBeLessThan(1e-13);
  });

  it("keep full precision near the separatrix, where 1 - 2 mu (3 + e) cancelled", () => {
    // fixture from tests/fixtures/generate_physics.py: mpmath elliprf at 50 digits at double mu within
    // 1e-2 .. 1e-12 (relative) of the separatrix 1/(6 + 2e), cross-checked against quadrature; was 2.8e-5
    const separatrix = loadFixture<{ advances: { massOverP: number; e: number; advance: string }[] }>("separatrix-orbits.json");
    let worst = 0;
    for (const row of separatrix.advances) worst = Math.max(worst, relativeError(advanceFromMassOverP(row.massOverP, row.e), Number(row.advance)));
    console.info(`advanceFromMassOverP near the separatrix: largest relative error ${worst.toExponential(2)}`);
    expect(worst).toBeLessThan(1e-15);
  });

  it("reject unbound or unstable orbits", () => {
    // the separatrix p = (6 + 2e) M (Cutler, Kennefick & Poisson 1994)
    expect(() => periastronAdvance(1, 1, 1)).toThrow(/eccentricity must be in \[0, 1\)/);
    expect(() => exactPeriastronAdvance(1e8, 1e-4, 0.1)).toThrow(/stable bound orbit/);
    expect(() => periastronAdvance(1, NaN, 0.1)).toThrow(/semiMajorAxisAu/);
  });

  it("give the one-way Shapiro delay, half the radar round trip", () => {
    // Shapiro 1964: (2GM/c^3) ln(4 r1 r2/b^2) one way. Earth (1 au) to Venus (0.723 au) grazing the
    // Sun: 9.85 us * ln(4 * 0.723 / 0.00465^2) = 116 us one way, ~230 us for the radar echo (Shapiro
    // 1964 predicted ~200 us round trips for Venus at superior conjunction; from memory)
    const oneWay = shapiroDelay(1, 1, 0.723, SOLAR_RADIUS_M / AU_M);
    expect(oneWay * 1e6).toBeCloseTo(116.28, 1);
    expect(shapiroDelay(2, 1, 0.723, SOLAR_RADIUS_M / AU_M)).toBe(2 * oneWay);
    expect(() => shapiroDelay(1, 1, 1, 2)).toThrow(/impactParameterAu must be in/);
  });

  it("give the shadow of Sgr A* as about 50 microarcseconds", () => {
    // 2 sqrt(27) GM/(c^2 D) (Synge 1966); 4.3e6 Msun at 8.3 kpc -> ~51 uas (from memory: EHT 2022 ~ 50 uas)
    const diameterUas = shadowAngularDiameter(4.3e6, 8300) / MICROARCSECOND_RAD;
    expect(diameterUas).toBeCloseTo(52.8, 0);
    expect(() => shadowAngularDiameter(1, 0)).toThrow(/distancePc/);
  });
});
