import { describe, expect, it } from "vitest";
import { assembleBundle, type TracedChunk } from "@/lib/bench/assemble-bundle";
import { bundleLayout, CYLINDER_PLANES } from "@/lib/bench/bundle-layout";
import { rayLineDistances, rayVertices, wavefrontPoints } from "@/lib/bench/bundle-vertices";

describe("bundle layout", () => {
  it("gives every ray its own impact parameter, alternating sides in a fan", () => {
    const layout = bundleLayout({ rayCount: 4, bMinM: 2, bMaxM: 10, layout: "fan" });
    expect(Array.from(layout.impactParametersM)).toEqual([3, 5, 7, 9]);
    expect(Array.from(layout.azimuthsRad)).toEqual([0, Math.PI, 0, Math.PI]);
    expect(layout.startRadiusM).toBe(30);
  });

  it("spreads a cylinder over its half-planes and starts wide bundles further out", () => {
    const layout = bundleLayout({ rayCount: 24, bMinM: 1, bMaxM: 40, layout: "cylinder" });
    expect(layout.planes).toBe(CYLINDER_PLANES);
    expect(layout.azimuthsRad[CYLINDER_PLANES]).toBe(0);
    expect(layout.azimuthsRad[3]).toBeCloseTo(Math.PI / 2, 15);
    expect(layout.startRadiusM).toBe(80);
  });
});

describe("bundle vertices and wavefronts", () => {
  // Two straight rays, 3 samples each, at unit speed: x = -2, 0, 2 at t = 0, 2, 4.
  const xy = new Float64Array([-2, 1, 0, 1, 2, 1, -2, 3, 0, 3, 2, 3]);
  const t = new Float64Array([0, 2, 4, 0, 2, 4]);
  const azimuths = new Float64Array([0, Math.PI / 2]);

  it("rotates each ray into its half-plane", () => {
    const vertices = rayVertices(xy, 2, 3, azimuths);
    expect(Array.from(vertices.slice(0, 3))).toEqual([-2, 1, 0]);
    expect(vertices[3 * 3 + 1]).toBeCloseTo(0, 6);
    expect(vertices[3 * 3 + 2]).toBe(3);
  });

  it("measures the distance along each ray from its own start", () => {
    expect(Array.from(rayLineDistances(xy, 2, 3))).toEqual([0, 2, 4, 0, 2, 4]);
  });

  it("interpolates where each ray is at each front time, and marks fronts a ray never reaches", () => {
    const points = wavefrontPoints(xy, t, 2, 3, new Float64Array([0, 0]), new Float64Array([1, 3, 5]));
    expect(Array.from(points.slice(0, 6))).toEqual([-1, 1, 0, 1, 1, 0]);
    expect(Number.isNaN(points[6])).toBe(true);
  });
});

describe("assembleBundle", () => {
  it("orders segments by fate, counts fates and joins fronts only between reached neighbours", () => {
    const samples = 2;
    const chunk: TracedChunk = {
      firstRay: 0,
      rayCount: 3,
      vertices: new Float32Array(3 * samples * 3),
      lineDistances: new Float32Array(3 * samples),
      fates: new Uint8Array([1, 0, 0]),
      wavefronts: new Float32Array([0, 0, 0, 0, 1, 0, NaN, NaN, NaN]),
    };
    const bundle = assembleBundle([chunk], 3, samples, 1, 1, 30);
    expect(bundle.fateCounts).toEqual({ escaped: 2, captured: 1, winding: 0 });
    expect(bundle.fateGroups).toEqual([
      { start: 0, count: 4, fate: "escaped" },
      { start: 4, count: 2, fate: "captured" },
      { start: 6, count: 0, fate: "winding" },
    ]);
    expect(Array.from(bundle.segmentIndex)).toEqual([2, 3, 4, 5, 0, 1]);
    expect(Array.from(bundle.wavefrontVertices)).toEqual([0, 0, 0, 0, 1, 0]);
  });
});
