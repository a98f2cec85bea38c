import { describe, expect, it } from "vitest";
import { airmassPickering, apparentAltitudeForAirmassDeg } from "@/lib/astro/airmass";

const DEG = Math.PI / 180;

/**
 * Kasten & Young 1989, Applied Optics 28, 4735, eq. 3 (coefficients from memory):
 * X = 1 / (sin h + 0.50572 (h + 6.07995°)^−1.6364). An independent published fit to the same tables.
 */
function airmassKastenYoung(altitudeDeg: number): number {
  return 1 / (Math.sin(altitudeDeg * DEG) + 0.50572 * (altitudeDeg + 6.07995) ** -1.6364);
}

describe("airmassPickering", () => {
  it("is 1 at the zenith and follows sec(z) high in the sky", () => {
    // Source: definition of relative air mass (X = 1 at the zenith); plane-parallel sec(z) is exact to
    // < 0.3% above 40° altitude (common practice).
    expect(airmassPickering(90)).toBeCloseTo(1, 6);
    for (const altitudeDeg of [40, 50, 60, 75]) {
      const secZ = 1 / Math.sin(altitudeDeg * DEG);
      expect(Math.abs(airmassPickering(altitudeDeg) / secZ - 1)).toBeLessThan(3e-3);
    }
  });

  it("stays within 1% of Kasten & Young 1989 down to 3° and within 3% at the horizon", () => {
    // Source: Kasten & Young 1989 formula (above). Horizon: K&Y give X(0°) ≈ 37.9, Pickering ≈ 38.8.
    for (let altitudeDeg = 3; altitudeDeg <= 90; altitudeDeg += 1) {
      expect(Math.abs(airmassPickering(altitudeDeg) / airmassKastenYoung(altitudeDeg) - 1)).toBeLessThan(0.01);
    }
    expect(Math.abs(airmassPickering(2) / airmassKastenYoung(2) - 1)).toBeLessThan(0.015);
    expect(Math.abs(airmassPickering(0) / airmassKastenYoung(0) - 1)).toBeLessThan(0.03);
    expect(airmassPickering(0)).toBeGreaterThan(30);
  });

  it("has no value below the apparent horizon or for NaN", () => {
    expect(airmassPickering(-0.1)).toBeNaN();
    expect(airmassPickering(Number.NaN)).toBeNaN();
  });
});

describe("apparentAltitudeForAirmassDeg", () => {
  it("inverts the air mass: airmass 2 is near 30° and round trips to 1e-8", () => {
    // Source: sec(z) = 2 at z = 60° (altitude 30°); the curved atmosphere moves it by under 0.2°.
    expect(apparentAltitudeForAirmassDeg(2)).toBeCloseTo(30, 0);
    for (const airmass of [1, 1.2, 1.5, 2, 3, 10, 30]) {
      expect(airmassPickering(apparentAltitudeForAirmassDeg(airmass))).toBeCloseTo(airmass, 6);
    }
    expect(apparentAltitudeForAirmassDeg(1e6)).toBe(0);
    expect(() => apparentAltitudeForAirmassDeg(0.9)).toThrow(RangeError);
  });
});
