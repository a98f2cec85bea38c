import { describe, expect, it } from "vitest";
import { assembleBundle, DASH_PHASE_SPAN_M, SPREAD_PASSES, type TracedChunk } from "@/lib/ray-view/assemble-bundle";
import { bundleLayout, CYLINDER_PLANES } from "@/lib/ray-view/bundle-layout";
import { arrivalTimes, drawnRays, wavefrontPoints } from "@/lib/ray-view/bundle-vertices";

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

  // The same rays clear of the photon sphere (where every point is kept).
  const farXy = new Float64Array([-2, 10, 0, 10, 2, 10, -2, 12, 0, 12, 2, 12]);

  it("draws a straight ray as its two end points, rotated into its half-plane", () => {
    const { vertices, pointCounts } = drawnRays(farXy, t, 2, 3, azimuths);
    expect(Array.from(pointCounts)).toEqual([2, 2]);
    expect(Array.from(vertices.slice(0, 6))).toEqual([-2, 10, 0, 2, 10, 0]);
    expect(vertices[2 * 3 + 1]).toBeCloseTo(0, 6);
    expect(vertices[2 * 3 + 2]).toBe(12);
  });

  it("keeps every point on the photon sphere", () => {
    const grazing = new Float64Array([-2, 3, 0, 3, 2, 3]);
    expect(Array.from(drawnRays(grazing, t, 1, 3, azimuths).pointCounts)).toEqual([3]);
  });

  it("measures the distance along each ray from its own start, over the full path", () => {
    // A bent ray: (0,10) → (1,10) → (1,11): the corner is kept and the distances are along the path.
    const bent = drawnRays(new Float64Array([0, 10, 1, 10, 1, 11]), t, 1, 3, new Float64Array([0]));
    expect(Array.from(bent.lineDistances)).toEqual([0, 1, 2]);
    expect(Array.from(drawnRays(farXy, t, 2, 3, azimuths).lineDistances)).toEqual([0, 4, 0, 4]);
  });

  it("keeps each kept point's coordinate time since its own ray's start, in single or double precision", () => {
    // The second ray's clock starts at 10: its points are at 0 and 4 since its start.
    const late = new Float32Array([0, 2, 4, 10, 12, 14]);
    expect(Array.from(drawnRays(farXy, late, 2, 3, azimuths).times)).toEqual([0, 4, 0, 4]);
    expect(Array.from(drawnRays(new Float32Array(farXy), t, 2, 3, azimuths).times)).toEqual([0, 4, 0, 4]);
  });

  it("gives an escaped ray's arrival time as its last sample's, and none to a captured ray", () => {
    const arrivals = arrivalTimes(new Float64Array([0, 2, 40.5, 0, 3, 7]), new Uint8Array([0, 1]), 3);
    expect(arrivals[0]).toBe(40.5);
    expect(Number.isNaN(arrivals[1])).toBe(true);
  });

  it("interpolates where each ray is at each front time, and marks fronts a ray never reaches", () => {
    const points = wavefrontPoints(xy, t, 2, 3, new Float64Array([0, 0]), new Float64Array([1, 3, 5]));
    expect(Array.from(points.slice(0, 6))).toEqual([-1, 1, 0, 1, 1, 0]);
    expect(Number.isNaN(points[6])).toBe(true);
  });
});

describe("assembleBundle", () => {
  it("orders segments by fate, counts fates and joins fronts only between reached neighbours", () => {
    const chunk: TracedChunk = {
      firstRay: 0,
      rayCount: 3,
      vertices: new Float32Array(3 * 2 * 3),
      lineDistances: new Float32Array(3 * 2),
      times: new Float32Array([0, 1, 0, 2, 0, 3]),
      pointCounts: new Uint32Array([2, 2, 2]),
      fates: new Uint8Array([1, 0, 0]),
      deflectionsRad: new Float32Array([NaN, 0.5, 0.25]),
      arrivalTimesM: new Float32Array([NaN, 61, 60.5]),
      wavefronts: new Float32Array([0, 0, 0, 0, 1, 0, NaN, NaN, NaN]),
    };
    const bundle = assembleBundle([chunk], 3, 1, new Float64Array([7]), 30);
    expect(bundle.fateCounts).toEqual({ escaped: 2, captured: 1, winding: 0, surface: 0 });
    expect(bundle.fateGroups).toEqual([
      { start: 0, count: 4, fate: "escaped" },
      { start: 4, count: 2, fate: "captured" },
      { start: 6, count: 0, fate: "winding" },
      { start: 6, count: 0, fate: "surface" },
    ]);
    expect(Array.from(bundle.segmentIndex)).toEqual([2, 3, 4, 5, 0, 1]);
    expect(Array.from(bundle.wavefrontVertices)).toEqual([0, 0, 0, 0, 1, 0]);
    expect(Array.from(bundle.wavefrontVertexTimesM)).toEqual([7, 7]);
    expect(bundle.latestTimeM).toBe(3);
    expect(Array.from(bundle.rayArrivalTimesM.slice(1))).toEqual([61, 60.5]);
    expect(Array.from(bundle.rayDeflectionsRad.slice(1))).toEqual([0.5, 0.25]);
    // The extent holds the photon sphere even when the rays do not reach it.
    expect(bundle.extentM).toEqual({ min: [-3, -3, -3], max: [3, 3, 3] });
  });

  it("offsets each ray's dashes by a different share of the phase span, so neighbours' dashes do not line up", () => {
    const rays = 5;
    const chunk: TracedChunk = {
      firstRay: 0,
      rayCount: rays,
      vertices: new Float32Array(rays * 2 * 3),
      lineDistances: new Float32Array(rays * 2).map((_, i) => (i % 2) * 10),
      times: new Float32Array(rays * 2),
      pointCounts: new Uint32Array(rays).fill(2),
      fates: new Uint8Array(rays),
      deflectionsRad: new Float32Array(rays),
      arrivalTimesM: new Float32Array(rays),
      wavefronts: new Float32Array(0),
    };
    const { lineDistances } = assembleBundle([chunk], rays, 1, new Float64Array(0), 30);
    const offsets = Array.from({ length: rays }, (_, ray) => lineDistances[2 * ray]);
    // Lengths along each ray are kept (only shifted).
    for (let ray = 0; ray < rays; ray++) expect(lineDistances[2 * ray + 1] - offsets[ray]).toBeCloseTo(10, 5);
    expect(offsets.every((offset) => offset >= 0 && offset < DASH_PHASE_SPAN_M)).toBe(true);
    const sorted = [...offsets].sort((a, b) => a - b);
    for (let k = 1; k < rays; k++) expect(sorted[k] - sorted[k - 1]).toBeGreaterThan(0.1 * DASH_PHASE_SPAN_M);
  });

  it("joins chunks of thinned rays in ray order whatever order they arrive in", () => {
    const chunk = (firstRay: number, pointCounts: number[]): TracedChunk => {
      const points = pointCounts.reduce((sum, count) => sum + count, 0);
      return {
        firstRay,
        rayCount: pointCounts.length,
        vertices: new Float32Array(points * 3).map((_, i) => firstRay * 100 + Math.floor(i / 3)),
        lineDistances: new Float32Array(points),
        times: new Float32Array(points),
        pointCounts: new Uint32Array(pointCounts),
        fates: new Uint8Array(pointCounts.length),
        deflectionsRad: new Float32Array(pointCounts.length),
        arrivalTimesM: new Float32Array(pointCounts.length),
        wavefronts: new Float32Array(0),
      };
    };
    const bundle = assembleBundle([chunk(2, [2]), chunk(0, [3, 2])], 3, 1, new Float64Array(0), 30);
    expect(Array.from(bundle.vertices.filter((_, i) => i % 3 === 0))).toEqual([0, 1, 2, 3, 4, 200, 201]);
    expect(Array.from(bundle.segmentIndex)).toEqual([0, 1, 1, 2, 3, 4, 5, 6]);
  });

  it("indexes the rays of a fate in interleaved passes", () => {
    const rays = 2 * SPREAD_PASSES;
    const chunk: TracedChunk = {
      firstRay: 0,
      rayCount: rays,
      vertices: new Float32Array(rays * 2 * 3),
      lineDistances: new Float32Array(rays * 2),
      times: new Float32Array(rays * 2),
      pointCounts: new Uint32Array(rays).fill(2),
      fates: new Uint8Array(rays),
      deflectionsRad: new Float32Array(rays),
      arrivalTimesM: new Float32Array(rays),
      wavefronts: new Float32Array(0),
    };
    const firstPoints = Array.from(assembleBundle([chunk], rays, 1, new Float64Array(0), 30).segmentIndex.filter((_, i) => i % 2 === 0));
    expect(firstPoints.slice(0, 4).map((point) => point / 2)).toEqual([0, SPREAD_PASSES, 1, SPREAD_PASSES + 1]);
  });

  it("thins a straight wavefront to its ends and breaks it where a ray never got there", () => {
    // One front, one half-plane: five rays on the line y = x + 10, then one that never reached the front.
    const fronts = new Float32Array([0, 10, 0, 1, 11, 0, 2, 12, 0, 3, 13, 0, 4, 14, 0, NaN, NaN, NaN]);
    const chunk: TracedChunk = {
      firstRay: 0,
      rayCount: 6,
      vertices: new Float32Array(6 * 2 * 3),
      lineDistances: new Float32Array(6 * 2),
      times: new Float32Array(6 * 2),
      pointCounts: new Uint32Array(6).fill(2),
      fates: new Uint8Array(6),
      deflectionsRad: new Float32Array(6),
      arrivalTimesM: new Float32Array(6),
      wavefronts: fronts,
    };
    expect(Array.from(assembleBundle([chunk], 6, 1, new Float64Array([5]), 30).wavefrontVertices)).toEqual([0, 10, 0, 4, 14, 0]);
  });
});
