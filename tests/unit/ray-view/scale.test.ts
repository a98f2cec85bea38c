import { describe, expect, it } from "vitest";
import { observerAxisTipM, ringLabelPlacement, ringLabelText, roundDownToNice, scaleRings } from "@/lib/ray-view/scale";

describe("the ray view's scale rings", () => {
  it("marks the horizon (2M) and the photon sphere (3M) of a compact lens, then round radii out to the start radius", () => {
    const rings = scaleRings(30, 0, undefined);
    expect(rings.map((ring) => [ring.kind, ring.radiusM])).toEqual([
      ["horizon", 2],
      ["photon-sphere", 3],
      ["round", 10],
      ["round", 20],
      ["round", 30],
    ]);
    expect(rings.map(ringLabelText)).toEqual(["horizon, r = 2 M", "photon sphere, r = 3 M", "10 M", "20 M", "30 M"]);
  });

  it("steps by 50 M for a bundle with b up to 100 M (R₀ = 200 M)", () => {
    expect(
      scaleRings(200, 0, undefined)
        .filter((ring) => ring.kind === "round")
        .map((ring) => ring.radiusM),
    ).toEqual([50, 100, 150, 200]);
  });

  it("labels each ring for the mass too: GM/c² = 1476.625 m per M☉ (IAU 2015 B3 nominal GM☉)", () => {
    // 10 M☉: 2M = 29.53 km, 3M = 44.3 km, 10 M = 147.7 km.
    const [horizon, photonSphere, ten] = scaleRings(30, 0, 10);
    expect(ringLabelText(horizon)).toBe("horizon, r = 2 M = 29.53 km");
    expect(ringLabelText(photonSphere)).toBe("photon sphere, r = 3 M = 44.3 km");
    expect(ringLabelText(ten)).toBe("10 M = 147.7 km");
    // 4.1e6 M☉: 50 M = 50 × 4.1e6 × 1476.625 m = 3.0271e11 m / 149597870700 m per au (IAU 2012 B2) = 2.023 au.
    expect(scaleRings(200, 0, 4.1e6).find((ring) => ring.radiusM === 50)?.physical).toBe("2.023 au");
  });

  it("shows a lens's surface instead of a horizon, and no round ring inside the body", () => {
    const rings = scaleRings(30, 12, undefined);
    expect(rings[0]).toMatchObject({ kind: "surface", radiusM: 12, label: "lens surface, R = 12 M" });
    expect(rings.filter((ring) => ring.kind === "round").map((ring) => ring.radiusM)).toEqual([20, 30]);
    expect(rings.some((ring) => ring.kind === "horizon" || ring.kind === "photon-sphere")).toBe(false);
  });

  it("places the horizon's and photon sphere's labels apart, the round ones on the source side", () => {
    expect(ringLabelPlacement({ kind: "horizon" }).side).toBe("left");
    expect(ringLabelPlacement({ kind: "photon-sphere" }).side).toBe("right");
    expect(ringLabelPlacement({ kind: "round" })).toEqual({ angleRad: (3 * Math.PI) / 4, side: "left" });
  });

  it("rounds down to 1, 2 or 5 × 10ⁿ and reaches the observer's axis past the rays", () => {
    expect([7.4, 19.9, 66.7, 0.3].map(roundDownToNice)).toEqual([5, 10, 50, 0.2]);
    expect(observerAxisTipM(223.6)).toBeCloseTo(241.49, 2);
  });
});
