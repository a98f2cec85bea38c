import { describe, expect, it } from "vitest";
import { angularSeparationArcsec, MAX_MATCH_TOLERANCE_ARCSEC, nameKey, TargetMatcher } from "@/lib/imports/matching";

describe("angularSeparationArcsec (Vincenty formula on the sphere)", () => {
  it("is exact along a meridian and the equator (spherical geometry)", () => {
    expect(angularSeparationArcsec(10, 0, 10, 1)).toBeCloseTo(3600, 9);
    expect(angularSeparationArcsec(0, 0, 90, 0)).toBeCloseTo(90 * 3600, 7);
  });

  it("stays accurate for tiny separations, where the law of cosines loses all digits", () => {
    // 1 mas in Dec at Dec −29°: the cosine formula rounds cos(4.8e-9 rad) to 1 and returns 0. The
    // bound is the rounding of the inputs themselves: 29° × 2^-52 ≈ 2.3e-11 arcsec.
    expect(angularSeparationArcsec(266.4168, -29.0078, 266.4168, -29.0078 + 1e-3 / 3600)).toBeCloseTo(1e-3, 10);
  });

  it("stays accurate for antipodal points, where haversine loses digits", () => {
    expect(angularSeparationArcsec(0, 10, 180, -10)).toBeCloseTo(180 * 3600, 6);
  });

  it("scales an RA difference by cos(Dec) (spherical geometry)", () => {
    expect(angularSeparationArcsec(0, 60, 1 / 3600, 60)).toBeCloseTo(0.5, 9);
  });

  it("handles the wrap of RA at 0/360°", () => {
    expect(angularSeparationArcsec(359.9999, 0, 0.0001, 0)).toBeCloseTo(0.72, 6);
  });
});

describe("nameKey", () => {
  it("ignores case and every kind of white space", () => {
    expect(nameKey("  Q 0957 +561\t")).toBe(nameKey("q0957+561"));
    expect(nameKey("Lantern\u00a0Arc")).toBe(nameKey("LANTERNARC"));
  });
});

describe("TargetMatcher", () => {
  const existing = [
    { id: "t1", name: "Lantern Arc", raDeg: 63.0396, decDeg: -15.5611 },
    { id: "t2", name: "Cinder Avocet", raDeg: 268.1325, decDeg: -29.6853 },
    { id: "t3", name: "Cinder Bunting", raDeg: 268.1325, decDeg: -29.6853 + 1.5 / 3600 },
  ];

  it("matches on the name first, whatever the position", () => {
    expect(new TargetMatcher(existing, 2).match({ name: "lantern  arc", raDeg: 0, decDeg: 0 })).toEqual({ by: "name", targetId: "t1" });
  });

  it("else matches the nearest target within the tolerance and reports the separation", () => {
    const match = new TargetMatcher(existing, 2).match({ name: "new", raDeg: 268.1325, decDeg: -29.6853 + 1.2 / 3600 });
    expect(match).toMatchObject({ by: "position", targetId: "t3" });
    expect(match?.by === "position" && match.separationArcsec).toBeCloseTo(0.3, 6);
  });

  it("does not match outside the tolerance", () => {
    // An RA step of 1/3600° at Dec −29.7° is 0.87″ on the sky (× cos Dec): inside 1″.
    expect(new TargetMatcher(existing, 1).match({ name: "new", raDeg: 268.1325 + 1.0 / 3600, decDeg: -29.6853 })).toMatchObject({ targetId: "t2" });
    expect(new TargetMatcher(existing, 1).match({ name: "new", raDeg: 268.1325 + 1.2 / 3600 / Math.cos((29.6853 * Math.PI) / 180), decDeg: -29.6853 })).toBeNull();
  });

  it("matches a later row of the same file to an earlier one once added", () => {
    const matcher = new TargetMatcher([], 2);
    expect(matcher.match({ name: "A", raDeg: 10, decDeg: 10 })).toBeNull();
    matcher.add({ id: "row-1", name: "A", raDeg: 10, decDeg: 10 });
    expect(matcher.match({ name: "B", raDeg: 10, decDeg: 10 + 1 / 3600 })).toMatchObject({ by: "position", targetId: "row-1" });
  });

  it("finds the match among many targets by the Dec index as a full scan would", () => {
    const many = Array.from({ length: 5000 }, (_, i) => ({ id: `t${i}`, name: `T${i}`, raDeg: (i * 7.3) % 360, decDeg: -89 + (i * 0.0357) }));
    const matcher = new TargetMatcher(many, 5);
    const probe = many[3210];
    expect(matcher.match({ name: "other", raDeg: probe.raDeg, decDeg: probe.decDeg + 2 / 3600 })).toMatchObject({ targetId: "t3210" });
  });

  it("refuses a tolerance that is not positive or above one degree", () => {
    expect(() => new TargetMatcher([], 0)).toThrow(RangeError);
    expect(() => new TargetMatcher([], MAX_MATCH_TOLERANCE_ARCSEC + 1)).toThrow(RangeError);
    expect(() => new TargetMatcher([], Number.NaN)).toThrow(RangeError);
  });
});
