import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { nextPeriapsisJdUtc, relativisticOrbitOf, SKY_SAMPLES, type RelativisticOrbit, type SkyPoint } from "@/lib/lensing/relativistic-orbit";
import type { OrbitInputs } from "@/lib/lensing/science-case-inputs";
import { ARCSECOND_RAD, JULIAN_YEAR_S, DAY_S } from "@/lib/physics/constants";
import { noOrbit, S2 } from "./orbit-inputs";

interface FixturePoint {
  index: number;
  northMas: number;
  eastMas: number;
}

interface FixtureOrbit {
  name: string;
  inputs: OrbitInputs;
  massSolar: string;
  semiMajorAxisAu: string;
  periapsisM: string;
  precessionExactRad: string;
  precessionFirstOrderRad: string;
  periapsisUtMinusOneKmPerS: string;
  periapsisStaticSpeedKmPerS: string;
  keplerPeriodDays: string;
  skyNewtonian?: FixturePoint[];
  skyPrecessing?: FixturePoint[];
  apoapsisShiftMicroarcsec?: number;
  apoapsisShiftFaceOnMicroarcsec?: number;
  roemerDelayS?: number;
  roemerDelayBoundS?: number;
}

// tests/fixtures/generate_relativistic_orbit.py: mpmath ellipk (Darwin 1961) checked against quadrature,
// astropy IAU constants, numpy rotation matrices for the sky, scipy for the Rømer range.
const fixture: { versions: Record<string, string>; samples: number; orbits: FixtureOrbit[] } = JSON.parse(
  readFileSync(fileURLToPath(new URL("../../fixtures/lensing/relativistic-orbit.json", import.meta.url)), "utf8"),
);

const ARCMINUTE_RAD = 60 * ARCSECOND_RAD;

function orbitOf(inputs: Partial<OrbitInputs>): RelativisticOrbit {
  const outcome = relativisticOrbitOf({ ...noOrbit, ...inputs });
  if ("missing" in outcome) throw new Error(outcome.missing);
  return outcome.orbit;
}

function relativeError(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.abs(expected);
}

/** The largest offset of a track, mas: the scale its errors are measured against. */
function trackScaleMas(points: readonly SkyPoint[]): number {
  return Math.max(...points.map((p) => Math.hypot(p.eastMas, p.northMas)));
}

describe("published values", () => {
  it("Mercury: 42.98″ per century from the first-order formula (Nobili & Will 1986, Nature 320, 39; Will 2014, Living Rev. Relativ. 17, 4; from memory)", () => {
    // Elements from memory of the planetary tables: a = 0.38709893 au, e = 0.20563069, P = 87.9691 d.
    const mercury = orbitOf({ centralMassSolar: 1, semiMajorAxisAu: 0.38709893, eccentricity: 0.20563069, periodDays: 87.9691 });
    const orbitsPerCentury = 36_525 / mercury.periodDays;
    const arcsecPerCentury = (mercury.precessionFirstOrderRad * orbitsPerCentury) / ARCSECOND_RAD;
    expect(arcsecPerCentury).toBeCloseTo(42.98, 2); // measured 42.9806
    // The exact value differs at the order of GM/(c² p) ~ 3e-8 (physics core's accuracy note).
    expect(relativeError(mercury.precessionExactRad, mercury.precessionFirstOrderRad)).toBeLessThan(2e-7);
  });

  it("S2 on its GRAVITY 2020 orbit advances ≈ 12′ per orbit (GRAVITY Collaboration 2020, A&A 636, L5: 12.1′, from memory)", () => {
    const s2 = orbitOf(S2);
    expect(s2.precessionExactRad / ARCMINUTE_RAD).toBeCloseTo(12.1, 0); // measured 12.17′
    expect(s2.precessionFirstOrderRad / ARCMINUTE_RAD).toBeCloseTo(12.1, 0); // measured 12.16′
    expect(Math.abs(s2.precessionExactRad / ARCMINUTE_RAD - 12.1)).toBeLessThan(0.1);
    // Periapsis ≈ 120 au ≈ 1400 Schwarzschild radii (2800 M) (GRAVITY 2018, from memory).
    expect(s2.periapsisAu).toBeCloseTo(119, 0);
    expect(s2.periapsisM).toBeCloseTo(2829, 0);
  });

  it("S2's combined gravitational and transverse-Doppler redshift at periapsis is ≈ 200 km/s (GRAVITY Collaboration 2018, A&A 615, L15, from memory)", () => {
    const { redshift, periapsisSpeedKmPerS } = orbitOf(S2);
    expect(redshift.combinedKmPerS).toBeGreaterThan(190);
    expect(redshift.combinedKmPerS).toBeLessThan(215); // measured 205.9 km/s
    expect(redshift.combinedKmPerS).toBeCloseTo(redshift.gravitationalKmPerS + redshift.transverseDopplerKmPerS, 10);
    // The two halves are comparable (≈ 106 and ≈ 100 km/s); v_p ≈ 7650 km/s in GRAVITY 2018 (from memory).
    expect(redshift.transverseDopplerKmPerS / redshift.gravitationalKmPerS).toBeCloseTo((1 + 0.884649) / 2, 12);
    expect(relativeError(periapsisSpeedKmPerS, 7650)).toBeLessThan(0.02); // measured 7739 km/s
  });
});

describe("against the mpmath fixture (tests/fixtures/generate_relativistic_orbit.py)", () => {
  it("records the reference libraries' versions", () => {
    expect(Object.keys(fixture.versions).sort()).toEqual(["astropy", "mpmath", "numpy", "python", "scipy"]);
    expect(fixture.samples).toBe(SKY_SAMPLES);
  });

  for (const row of fixture.orbits) {
    describe(row.name, () => {
      const orbit = orbitOf(row.inputs);

      it("mass, semi-major axis, periapsis in M and period", () => {
        expect(relativeError(orbit.massSolar, Number(row.massSolar))).toBeLessThan(1e-14);
        expect(orbit.massFrom).toBe(row.inputs.centralMassSolar === null ? "period" : "lens mass");
        expect(relativeError(orbit.semiMajorAxisAu, Number(row.semiMajorAxisAu))).toBeLessThan(1e-15);
        expect(relativeError(orbit.periapsisM, Number(row.periapsisM))).toBeLessThan(1e-14);
        const period = row.inputs.periodDays ?? Number(row.keplerPeriodDays);
        expect(relativeError(orbit.periodDays, period)).toBeLessThan(1e-14);
      });

      it("exact precession (Darwin 1961 elliptic integral) and the first-order 6πGM/(c²a(1 − e²))", () => {
        expect(relativeError(orbit.precessionExactRad, Number(row.precessionExactRad))).toBeLessThan(1e-13);
        expect(relativeError(orbit.precessionFirstOrderRad, Number(row.precessionFirstOrderRad))).toBeLessThan(1e-14);
      });

      it("the exact redshift c (u^t − 1) and the static observer's speed at periapsis (Cutler, Kennefick & Poisson 1994 E and L)", () => {
        const exact = Number(row.periapsisUtMinusOneKmPerS);
        expect(relativeError(orbit.redshift.exactKmPerS, exact)).toBeLessThan(1e-13);
        expect(relativeError(orbit.periapsisSpeedExactKmPerS, Number(row.periapsisStaticSpeedKmPerS))).toBeLessThan(1e-13);
        // The first-order values approach them to O(GM/(c² r_p)).
        expect(relativeError(orbit.redshift.combinedKmPerS, exact)).toBeLessThan(3 / orbit.periapsisM);
        expect(relativeError(orbit.periapsisSpeedKmPerS, orbit.periapsisSpeedExactKmPerS)).toBeLessThan(3 / orbit.periapsisM);
      });

      if (row.skyNewtonian !== undefined) {
        it("the Newtonian sky track (Thiele–Innes) against numpy's rotation matrices", () => {
          const track = orbit.skyNewtonian!;
          expect(track).toHaveLength(SKY_SAMPLES);
          const scale = trackScaleMas(track);
          for (const point of row.skyNewtonian!) {
            expect(Math.abs(track[point.index].northMas - point.northMas)).toBeLessThan(1e-13 * scale);
            expect(Math.abs(track[point.index].eastMas - point.eastMas)).toBeLessThan(1e-13 * scale);
          }
        });

        it("the precessing sky track (the physics core's tracer) against the mpmath orbit", () => {
          const track = orbit.skyPrecessing!;
          expect(track).toHaveLength(SKY_SAMPLES);
          const scale = trackScaleMas(track);
          for (const point of row.skyPrecessing!) {
            expect(Math.abs(track[point.index].northMas - point.northMas)).toBeLessThan(1e-12 * scale);
            expect(Math.abs(track[point.index].eastMas - point.eastMas)).toBeLessThan(1e-12 * scale);
          }
        });

        it("the apoapsis shift per orbit and the Rømer range", () => {
          expect(relativeError(orbit.apoapsisShiftMicroarcsec!, row.apoapsisShiftMicroarcsec!)).toBeLessThan(1e-10);
          expect(relativeError(orbit.roemerDelayS, row.roemerDelayS!)).toBeLessThan(1e-10);
          expect(orbit.orientationGiven).toBe(true);
          const unoriented = orbitOf({ ...row.inputs, inclinationDeg: null, nodeDeg: null, periapsisArgumentDeg: null });
          expect(unoriented.orientationGiven).toBe(false);
          expect(relativeError(unoriented.apoapsisShiftMicroarcsec!, row.apoapsisShiftFaceOnMicroarcsec!)).toBeLessThan(1e-12);
          expect(relativeError(unoriented.roemerDelayS, row.roemerDelayBoundS!)).toBeLessThan(1e-14);
          expect(unoriented.skyNewtonian).toBeNull();
          expect(unoriented.skyPrecessing).toBeNull();
        });
      }
    });
  }
});

describe("the sky tracks", () => {
  const s2 = orbitOf(S2);

  it("the Newtonian ellipse closes; the precessing orbit ends one advance further on", () => {
    const newtonian = s2.skyNewtonian!;
    const precessing = s2.skyPrecessing!;
    const first = newtonian[0];
    const last = newtonian[SKY_SAMPLES - 1];
    expect(Math.hypot(last.eastMas - first.eastMas, last.northMas - first.northMas)).toBeLessThan(1e-12);
    expect(precessing[0].eastMas).toBeCloseTo(first.eastMas, 12);
    // The periapsis, 14.4 mas from the mass at 8.2 kpc, moves by ≈ r_p Δφ (projected): tens of µas.
    const periapsisMoveMas = Math.hypot(precessing[SKY_SAMPLES - 1].eastMas - first.eastMas, precessing[SKY_SAMPLES - 1].northMas - first.northMas);
    expect(periapsisMoveMas).toBeGreaterThan(0.02);
    expect(periapsisMoveMas).toBeLessThan(((s2.periapsisAu * 1000) / 8246.7) * s2.precessionExactRad * 1.0001);
  });

  it("S2's apoapsis lies ≈ 0.2″ north of Sgr A* (its orbit runs north–south on the sky, from memory of the GRAVITY figures)", () => {
    const apoapsis = s2.skyNewtonian![(SKY_SAMPLES - 1) / 2];
    expect(apoapsis.northMas).toBeGreaterThan(150);
    expect(Math.abs(apoapsis.eastMas)).toBeLessThan(apoapsis.northMas);
  });

  it("needs the distance, the inclination, the node and the argument of periapsis", () => {
    expect(orbitOf({ ...S2, nodeDeg: null }).skyNewtonian).toBeNull();
    expect(orbitOf({ ...S2, nodeDeg: null }).apoapsisShiftMicroarcsec).toBeCloseTo(s2.apoapsisShiftMicroarcsec!, 9);
    const inAu = orbitOf({ ...S2, semiMajorAxisMas: null, semiMajorAxisAu: s2.semiMajorAxisAu, distancePc: null });
    expect(inAu.skyPrecessing).toBeNull();
    expect(inAu.apoapsisShiftMicroarcsec).toBeNull();
    expect(inAu.precessionExactRad).toBe(s2.precessionExactRad);
  });
});

describe("the next periapsis", () => {
  const s2 = orbitOf(S2);
  const P = s2.periodDays;
  // 2018.379 as a Julian date (J2000 + 18.379 Julian years), from the GRAVITY 2020 elements (from memory).
  const t0 = 2_451_545 + (18.379 * JULIAN_YEAR_S) / DAY_S;

  it("is the first passage T0 + kP at or after the date, whichever side of it T0 lies", () => {
    expect(nextPeriapsisJdUtc(s2, t0, t0)).toBe(t0);
    expect(nextPeriapsisJdUtc(s2, t0, t0 + 0.5 * P)).toBeCloseTo(t0 + P, 6);
    expect(nextPeriapsisJdUtc(s2, t0, t0 - 2.5 * P)).toBeCloseTo(t0 - 2 * P, 6);
    expect(nextPeriapsisJdUtc(s2, t0 + 3 * P, t0 + 1)).toBeCloseTo(t0 + P, 6);
    // The next after 2027-03-01: 2034.4 (2018.379 + 16.0455 yr).
    const next = nextPeriapsisJdUtc(s2, t0, 2_461_465.5);
    expect((next - 2_451_545) / 365.25 + 2000).toBeCloseTo(2034.42, 2);
  });

  it("refuses dates that are not finite", () => {
    expect(() => nextPeriapsisJdUtc(s2, Number.NaN, t0)).toThrow(RangeError);
  });
});

describe("missing and unusable inputs, in the user's words", () => {
  it("names every missing element in one sentence", () => {
    expect(relativisticOrbitOf(noOrbit)).toEqual({
      missing: "Set the orbit's semi-major axis (in au, or as an angle with the lens distance), the orbit's eccentricity and the lens mass or the orbital period to compute the star's orbit.",
    });
    expect(relativisticOrbitOf({ ...noOrbit, semiMajorAxisMas: 125, eccentricity: 0.5, centralMassSolar: 4e6 })).toEqual({
      missing: "Set the lens distance (the semi-major axis is given as an angle) to compute the star's orbit.",
    });
  });

  it("takes the mass from the period by Kepler's third law when no lens mass is set", () => {
    const fromPeriod = orbitOf({ ...S2, centralMassSolar: null });
    expect(fromPeriod.massFrom).toBe("period");
    expect(relativeError(fromPeriod.massSolar, 4.261e6)).toBeLessThan(1e-4);
  });

  it("refuses a circular, unbound or plunging orbit and non-positive lengths", () => {
    const base: OrbitInputs = { ...noOrbit, centralMassSolar: 4e6, semiMajorAxisAu: 1000, eccentricity: 0.5 };
    expect(relativisticOrbitOf({ ...base, eccentricity: 0 })).toEqual({ missing: expect.stringMatching(/^A circular orbit \(eccentricity 0\) has no periapsis/) });
    expect(relativisticOrbitOf({ ...base, eccentricity: 1 })).toEqual({ missing: "The orbit's eccentricity must be at least 0 and below 1 (a bound orbit)." });
    expect(relativisticOrbitOf({ ...base, eccentricity: Number.NaN })).toEqual({ missing: "The orbit's eccentricity must be at least 0 and below 1 (a bound orbit)." });
    expect(relativisticOrbitOf({ ...base, semiMajorAxisAu: -1 })).toEqual({ missing: "The orbit's semi-major axis must be a length above 0." });
    expect(relativisticOrbitOf({ ...base, centralMassSolar: 0 })).toEqual({ missing: "The lens mass must be above 0." });
    expect(relativisticOrbitOf({ ...base, nodeDeg: Number.POSITIVE_INFINITY })).toEqual({ missing: "The longitude of the ascending node must be an angle in degrees." });
    // GM/c² = 0.0395 au for 4 × 10⁶ M☉: periapsis 0.1 au = 2.53 M, p = 0.15 au = 3.8 M, below the separatrix 7 M.
    expect(relativisticOrbitOf({ ...base, semiMajorAxisAu: 0.2 })).toEqual({ missing: expect.stringMatching(/^The star would pass within 2\.53 GM\/c² of the compact mass, inside the last stable orbits/) });
  });
});

// The kept outcome must be the computed one (checked above against Mercury, S2 and mpmath), handed
// back for equal inputs only.
describe("an orbit asked for again", () => {
  it("is the outcome already computed for equal inputs, and computed afresh for others", () => {
    const first = relativisticOrbitOf(S2);
    expect(relativisticOrbitOf({ ...S2 })).toBe(first);
    const other = relativisticOrbitOf({ ...S2, eccentricity: 0.5 });
    expect(other).not.toBe(first);
    expect("orbit" in other && "orbit" in first && other.orbit.eccentricity).toBe(0.5);
  });
});
