import { describe, expect, it } from "vitest";
import { DRAWN_MAX_TURN_RAD, keptSamples, PHOTON_SPHERE_SHELL_M, type StridedPath } from "@/lib/ray-view/polyline-decimation";
import { bundleLayout } from "@/lib/ray-view/bundle-layout";
import { criticalImpactParameter, traceRayBundle } from "@/lib/physics";

const planar = (xy: Float32Array | Float64Array, first: number, count: number): StridedPath => ({ coords: xy, offset: 2 * first, stride: 2, dims: 2, count });

function kept(path: StridedPath): number[] {
  const out = new Uint32Array(path.count);
  return Array.from(out.subarray(0, keptSamples(path, out)));
}

/** Largest angle between a chord joining kept points and a traced segment it replaces, radians. */
function worstChordAngle(xy: Float32Array | Float64Array, first: number, keptIndices: number[]): number {
  const point = (s: number) => [xy[2 * (first + s)], xy[2 * (first + s) + 1]];
  let worst = 0;
  for (let k = 0; k + 1 < keptIndices.length; k++) {
    const [ax, ay] = point(keptIndices[k]);
    const [bx, by] = point(keptIndices[k + 1]);
    const chord = Math.atan2(by - ay, bx - ax);
    for (let s = keptIndices[k]; s < keptIndices[k + 1]; s++) {
      const [px, py] = point(s);
      const [qx, qy] = point(s + 1);
      if (px === qx && py === qy) continue;
      const angle = Math.abs(Math.atan2(Math.sin(Math.atan2(qy - py, qx - px) - chord), Math.cos(Math.atan2(qy - py, qx - px) - chord)));
      worst = Math.max(worst, angle);
    }
  }
  return worst;
}

describe("keptSamples", () => {
  it("keeps only the end points of a straight line, and of a two-point path", () => {
    const line = new Float64Array(Array.from({ length: 50 }, (_, s) => [s - 25, 20]).flat());
    expect(kept(planar(line, 0, 50))).toEqual([0, 49]);
    expect(kept(planar(new Float64Array([0, 10, 1, 10]), 0, 2))).toEqual([0, 1]);
  });

  it("keeps a sharp corner", () => {
    const corner = new Float64Array([0, 10, 1, 10, 2, 10, 2, 11, 2, 12]);
    expect(kept(planar(corner, 0, 5))).toEqual([0, 2, 4]);
  });

  it("ignores repeated points", () => {
    const repeated = new Float64Array([0, 10, 1, 10, 1, 10, 2, 10]);
    expect(kept(planar(repeated, 0, 4))).toEqual([0, 3]);
  });

  it("bounds the angle between every drawn chord and the traced path it replaces, on real rays", () => {
    const layout = bundleLayout({ rayCount: 400, bMinM: 0.5, bMaxM: 40, layout: "fan" });
    const traced = traceRayBundle(layout.impactParametersM, 1, { samples: layout.samples, startRadius: layout.startRadiusM, rtol: 1e-7 });
    let keptTotal = 0;
    for (let ray = 0; ray < 400; ray++) {
      const first = ray * layout.samples;
      const indices = kept(planar(traced.xy, first, layout.samples));
      keptTotal += indices.length;
      expect(indices[0]).toBe(0);
      expect(indices.at(-1)).toBe(layout.samples - 1);
      expect(worstChordAngle(traced.xy, first, indices)).toBeLessThanOrEqual(DRAWN_MAX_TURN_RAD + 1e-9);
    }
    // The point of it: far fewer points to draw.
    expect(keptTotal).toBeLessThan(0.25 * 400 * layout.samples);
  });

  it("keeps every sample on the photon sphere, and most of a ray that winds round it", () => {
    const samples = 160;
    const b = new Float64Array([criticalImpactParameter(1) * (1 + 1e-6)]);
    const traced = traceRayBundle(b, 1, { samples, startRadius: 30, rtol: 1e-7 });
    const indices = new Set(kept(planar(traced.xy, 0, samples)));
    let near = 0;
    for (let s = 0; s < samples; s++) {
      if (Math.abs(Math.hypot(traced.xy[2 * s], traced.xy[2 * s + 1]) - 3) >= PHOTON_SPHERE_SHELL_M) continue;
      near += 1;
      expect(indices.has(s)).toBe(true);
    }
    expect(near).toBeGreaterThan(samples / 2);
  });

  it("thins a 3D path read with a stride (a wavefront across rays)", () => {
    // Points every second entry of six: a straight front at z = 5, with other data between.
    const coords = new Float32Array([0, 10, 5, 9, 9, 9, 1, 10, 5, 9, 9, 9, 2, 10, 5, 9, 9, 9]);
    expect(kept({ coords, offset: 0, stride: 6, dims: 3, count: 3 })).toEqual([0, 2]);
  });
});
