import { describe, expect, it } from "vitest";
import { exactDeflection, sweptAngleFromInfinity } from "@/lib/physics/deflection";
import { traceBoundOrbit } from "@/lib/physics/orbit-tracer";
import { CAPTURE_MARGIN, traceRay, traceRayBundle } from "@/lib/physics/ray-tracer";
import { loadFixture, relativeError } from "./fixtures";

const BC = 3 * Math.sqrt(3);

interface FarRaysFixture {
  deflections: { b: number; alpha: string }[];
  travelTimes: { b: number; startRadius: number; coordinateTime: string }[];
}
const farRays = loadFixture<FarRaysFixture>("far-rays.json");

function radiusAt(xy: Float64Array, i: number): number {
  return Math.hypot(xy[2 * i], xy[2 * i + 1]);
}

describe("traceRay", () => {
  it("starts at (-R, b) and ends at the same radius when it escapes", () => {
    // the geometry of the API contract (common practice)
    const ray = traceRay(10, 1);
    expect(ray.count).toBe(512);
    expect(ray.xy.length).toBe(1024);
    expect(ray.xy[0]).toBeCloseTo(-60, 12);
    expect(ray.xy[1]).toBeCloseTo(10, 12);
    expect(ray.t[0]).toBe(0);
    expect(radiusAt(ray.xy, 511)).toBeCloseTo(Math.hypot(60, 10), 9);
    expect(ray.fate).toBe("escaped");
    expect(ray.halfTurns).toBe(1);
  });

  it("gives deflections that agree with the closed form to 1e-9", () => {
    // exactDeflection (Darwin 1959 closed form, itself checked against mpmath fixtures)
    let worstAbsolute = 0;
    let worstRelative = 0;
    for (const b of [5.4, 5.6, 6, 8, 10, 20, 29.5, 45, 100, 1000]) {
      const ray = traceRay(b, 1);
      const exact = exactDeflection(b, 1);
      worstAbsolute = Math.max(worstAbsolute, Math.abs(ray.deflection - exact));
      if (exact > 0.1) worstRelative = Math.max(worstRelative, Math.abs(ray.deflection - exact) / exact);
    }
    console.info(`traceRay: largest deflection error ${worstAbsolute.toExponential(2)} rad, ${worstRelative.toExponential(2)} relative for alpha > 0.1, at rtol 1e-10`);
    expect(worstAbsolute).toBeLessThan(1e-9);
    expect(worstRelative).toBeLessThan(1e-9);
  });

  it("gives weakly deflected rays the exact deflection, where the integrator's floor exceeded it", () => {
    // fixture from tests/fixtures/generate_physics.py: mpmath quadrature at 40 + 2 log10(b) digits.
    // The traced value carried ~7e-11 rad of error: 7e-6 relative at the solar limb (b = 4.7e5 M),
    // and a negative alpha at b = 1e11 M
    let worst = 0;
    for (const row of farRays.deflections) {
      const deflection = traceRay(row.b, 1).deflection;
      expect(deflection).toBeGreaterThan(0);
      worst = Math.max(worst, relativeError(deflection, Number(row.alpha)));
    }
    console.info(`traceRay, b from 1e3 M to 1e200 M: largest relative deflection error ${worst.toExponential(2)}`);
    expect(worst).toBeLessThan(4e-16);
  });

  it("keeps a weak ray's path and travel time consistent with its deflection", () => {
    // the swept angle between the end points is pi + alpha minus the exact tails beyond them (Darwin
    // 1959; sweptAngleFromInfinity is checked against mpmath); travel times from the fixture above
    let worstAngle = 0;
    let worstTime = 0;
    for (const row of farRays.travelTimes) {
      const ray = traceRay(row.b, 1, { startRadius: row.startRadius });
      const last = ray.count - 1;
      const endRadius = radiusAt(ray.xy, last);
      const traced = Math.atan2(ray.xy[1], ray.xy[0]) - Math.atan2(ray.xy[2 * last + 1], ray.xy[2 * last]);
      const expected = Math.PI + ray.deflection - sweptAngleFromInfinity(radiusAt(ray.xy, 0), row.b, 1) - sweptAngleFromInfinity(endRadius, row.b, 1);
      worstAngle = Math.max(worstAngle, Math.abs(traced - expected));
      worstTime = Math.max(worstTime, relativeError(ray.t[last], Number(row.coordinateTime)));
    }
    console.info(`traceRay, b from 1e3 M to 1e12 M: swept angle within ${worstAngle.toExponential(2)} rad of the deflection, travel time ${worstTime.toExponential(2)} relative`);
    expect(worstAngle).toBeLessThan(2e-10);
    expect(worstTime).toBeLessThan(1e-10);
  });

  it("traces b = 1e103 M and names b when |b| exceeds 1e300 M", () => {
    // 4M/b far from the lens (Einstein 1916); it threw "x must be finite" from inside the tails
    const ray = traceRay(1e103, 1);
    expect(ray.fate).toBe("escaped");
    expect(ray.deflection).toBe(4e-103);
    expect(radiusAt(ray.xy, ray.count - 1) / 1e103).toBeCloseTo(Math.sqrt(5), 9);
    expect(() => traceRay(1e301, 1)).toThrow(/^b must be finite, with \|b\| <= 1e300 M/);
    expect(() => traceRay(1, 1e-308)).toThrow(/^b must be/);
    expect(() => traceRayBundle(new Float64Array([1, -2e300]), 1)).toThrow(/^impactParameters\[1\] must be finite, with \|b\|/);
    // a huge M with a moderate b/M: the default start radius 2 max(|b|, 30 M) overflowed and was blamed
    expect(traceRay(1e308, 1e300).fate).toBe("escaped");
    // |b| <= 1e-100 M is the radial ray (b = 0): it underflowed to samples all at the origin
    const nearlyRadial = traceRay(1e-200, 1);
    expect(nearlyRadial.fate).toBe("captured");
    expect(radiusAt(nearlyRadial.xy, 0)).toBe(60);
    expect(radiusAt(nearlyRadial.xy, nearlyRadial.count - 1)).toBeCloseTo(2 * (1 + CAPTURE_MARGIN), 12);
  });

  it("conserves the photon's first integral along the sampled path", () => {
    // (du/dphi)^2 + u^2 - 2 M u^3 = 1/b^2 (Darwin 1959): check via r(phi) finite differences
    const b = 7;
    const ray = traceRay(b, 1, { samples: 4096 });
    let worst = 0;
    for (let i = 1; i < 4095; i++) {
      const phi = (k: number) => Math.atan2(ray.xy[2 * k + 1], ray.xy[2 * k]);
      const u = (k: number) => 1 / radiusAt(ray.xy, k);
      const dPhi = phi(i + 1) - phi(i - 1);
      const dudphi = (u(i + 1) - u(i - 1)) / dPhi;
      const invB2 = dudphi * dudphi + u(i) ** 2 - 2 * u(i) ** 3;
      worst = Math.max(worst, Math.abs(invB2 * b * b - 1));
    }
    expect(worst).toBeLessThan(1e-5);
  });

  it("gives the coordinate travel time of the exact ray to 1e-9", () => {
    // fixture from tests/fixtures/generate_physics.py: mpmath quadrature of dt/dr along the ray
    const travel = loadFixture<{ travelTimes: { b: number; startRadius: number; coordinateTime: string }[] }>("deflection.json").travelTimes;
    let worst = 0;
    for (const row of travel) {
      const ray = traceRay(row.b, 1, { startRadius: row.startRadius });
      worst = Math.max(worst, relativeError(ray.t[ray.count - 1], Number(row.coordinateTime)));
    }
    console.info(`traceRay: largest relative error of the travel time ${worst.toExponential(2)} at rtol 1e-10`);
    expect(worst).toBeLessThan(1e-9);
  });

  it("gives coordinate time close to the flat travel time far from the lens", () => {
    // weak field: t ~ path length + Shapiro excess 2M ln(...) (Shapiro 1964), order 10 M here
    const ray = traceRay(50, 1, { startRadius: 1000 });
    const flat = 2 * 1000;
    expect(ray.t[ray.count - 1]).toBeGreaterThan(flat);
    expect(ray.t[ray.count - 1] - flat).toBeLessThan(40);
    for (let i = 1; i < ray.count; i++) expect(ray.t[i]).toBeGreaterThan(ray.t[i - 1]);
  });

  it("captures rays below b_c at r = 2M (1 + margin)", () => {
    // Darwin 1959: b < 3 sqrt(3) M falls in
    for (const b of [0, 1, 5, BC * (1 - 1e-3)]) {
      const ray = traceRay(b, 1);
      expect(ray.fate === "captured" || ray.fate === "winding").toBe(true);
      expect(ray.deflection).toBeNaN();
      expect(radiusAt(ray.xy, ray.count - 1)).toBeCloseTo(2 * (1 + CAPTURE_MARGIN), 8);
    }
    expect(traceRay(3, 1).fate).toBe("captured");
    expect(traceRay(0, 1).t[511]).toBeGreaterThan(58);
  });

  it("marks rays that circle the photon sphere as winding and counts half-turns", () => {
    // alpha ~ -ln(b/b_c - 1) - 0.40 (Bozza 2002): at b/b_c - 1 = 1e-6 the ray sweeps ~ pi + 13.4 rad
    const ray = traceRay(BC * (1 + 1e-6), 1);
    expect(ray.fate).toBe("winding");
    expect(ray.deflection).toBeNaN();
    expect(ray.halfTurns).toBe(Math.floor((Math.PI + exactDeflection(BC * (1 + 1e-6), 1) - 0.17) / Math.PI));
    const capped = traceRay(BC * (1 + 1e-15), 1, { maxHalfTurns: 4 });
    expect(capped.fate).toBe("winding");
    expect(capped.halfTurns).toBe(4);
  });

  it("mirrors negative impact parameters", () => {
    // symmetry y -> -y of the equatorial problem (common practice)
    const up = traceRay(8, 1);
    const down = traceRay(-8, 1);
    expect(down.deflection).toBe(up.deflection);
    expect(down.xy[101]).toBe(-up.xy[101]);
    expect(down.xy[100]).toBe(up.xy[100]);
  });

  it("scales with M", () => {
    // geometrized units: the path in units of M depends on b/M only
    const a = traceRay(20, 2, { startRadius: 120 });
    const b = traceRay(10, 1, { startRadius: 60 });
    expect(a.deflection).toBeCloseTo(b.deflection, 14);
    expect(a.xy[600]).toBeCloseTo(b.xy[600], 9);
  });

  it("rejects bad arguments", () => {
    // common practice: RangeError naming the argument and its domain
    expect(() => traceRay(NaN, 1)).toThrow(/^b must be finite/);
    expect(() => traceRay(Infinity, 1)).toThrow(RangeError);
    expect(() => traceRay(5, 0)).toThrow(/M must be/);
    expect(() => traceRay(5, 1, { samples: 1 })).toThrow(/options.samples/);
    expect(() => traceRay(5, 1, { rtol: 0 })).toThrow(/options.rtol/);
    expect(() => traceRay(5, 1, { startRadius: 3 })).toThrow(/options.startRadius/);
  });
});

describe("traceRayBundle", () => {
  it("packs every ray into one buffer, samples points each, matching traceRay", () => {
    // contract of the bundle (common practice); the same integrator as traceRay. Samples are compared
    // through Math.fround: the bundle stores traceRay's doubles in single precision (next test)
    const bs = new Float64Array([-40, -3, 0, 5.3, 12, 40]);
    const bundle = traceRayBundle(bs, 1, { samples: 64 });
    expect(bundle.samples).toBe(64);
    expect(bundle.xy.length).toBe(6 * 64 * 2);
    expect(bundle.t.length).toBe(6 * 64);
    expect(Array.from(bundle.fates)).toEqual([0, 1, 1, 2, 0, 0]);
    const single = traceRay(12, 1, { samples: 64, startRadius: 80 });
    expect(bundle.deflections[4]).toBe(single.deflection);
    expect(bundle.xy[4 * 128 + 50]).toBe(Math.fround(single.xy[50]));
    expect(bundle.t[4 * 64 + 30]).toBe(Math.fround(single.t[30]));
    // the start point (-80, -40): -80 M rounds to itself in single precision
    expect(bundle.xy[0]).toBe(-80);
    expect(Number.isNaN(bundle.deflections[1])).toBe(true);
  });

  it("stores each sample as traceRay's double rounded once to single precision, in Float32Arrays", () => {
    // IEEE 754 round to nearest (what a Float32Array store and Math.fround do): relative error
    // <= 2^-24 = 6e-8, far below a drawn pixel. A bundle that kept doubles (or rounded twice, or
    // sampled differently) fails either the type check or the exact comparison
    const bs = new Float64Array([-25, -5.2, 0, 1e-200, 3 * Math.sqrt(3) * (1 + 1e-6), 7, 60, 1e6]);
    const samples = 97;
    const bundle = traceRayBundle(bs, 1, { samples, startRadius: 120 });
    expect(bundle.xy).toBeInstanceOf(Float32Array);
    expect(bundle.t).toBeInstanceOf(Float32Array);
    expect(bundle.deflections).toBeInstanceOf(Float64Array);
    let worstRelative = 0;
    bs.forEach((b, ray) => {
      const single = traceRay(b, 1, { samples, startRadius: 120 });
      for (let j = 0; j < 2 * samples; j++) {
        expect(bundle.xy[2 * ray * samples + j]).toBe(Math.fround(single.xy[j]));
        if (single.xy[j] !== 0) worstRelative = Math.max(worstRelative, relativeError(bundle.xy[2 * ray * samples + j], single.xy[j]));
      }
      for (let j = 0; j < samples; j++) expect(bundle.t[ray * samples + j]).toBe(Math.fround(single.t[j]));
      expect(bundle.deflections[ray]).toBe(single.deflection);
    });
    expect(worstRelative).toBeLessThanOrEqual(2 ** -24);
  });

  it("writes into the buffers of options.into, which may be longer, and names one that is too short", () => {
    // the reuse contract (common practice): same samples as fresh buffers, as views of the given ones
    const bs = new Float64Array([-12, 4, 30]);
    const fresh = traceRayBundle(bs, 1, { samples: 32 });
    const into = { xy: new Float32Array(3 * 64 + 10).fill(Number.NaN), t: new Float32Array(3 * 32 + 5).fill(Number.NaN) };
    const reused = traceRayBundle(bs, 1, { samples: 32, into });
    expect(reused.xy.buffer).toBe(into.xy.buffer);
    expect(reused.t.buffer).toBe(into.t.buffer);
    expect(Array.from(reused.xy)).toEqual(Array.from(fresh.xy));
    expect(Array.from(reused.t)).toEqual(Array.from(fresh.t));
    expect(Array.from(reused.deflections)).toEqual(Array.from(fresh.deflections));
    expect(Number.isNaN(into.xy[3 * 64])).toBe(true);
    expect(() => traceRayBundle(bs, 1, { samples: 32, into: { xy: new Float32Array(191), t: into.t } })).toThrow(/^options\.into\.xy must be a Float32Array of at least 192 values/);
    expect(() => traceRayBundle(bs, 1, { samples: 32, into: { xy: into.xy, t: new Float32Array(95) } })).toThrow(/^options\.into\.t must be a Float32Array of at least 96 values/);
  });

  it("keeps every sample finite in single precision: |b| up to 1e30 M, and names a larger b or start radius", () => {
    // single-precision maximum 3.4e38 (IEEE 754); traceRay's doubles reach 1e300 M
    const far = traceRayBundle(new Float64Array([1e30, -1e30]), 1);
    expect(far.xy.every(Number.isFinite)).toBe(true);
    expect(far.t.every(Number.isFinite)).toBe(true);
    expect(far.xy[0]).toBe(Math.fround(-2e30));
    expect(() => traceRayBundle(new Float64Array([1, -2e30]), 1)).toThrow(/^impactParameters\[1\] must be finite, with \|b\| <= 1e30 M/);
    expect(() => traceRayBundle(new Float64Array([1]), 1, { startRadius: 3e30 })).toThrow(/^options\.startRadius must be finite, > 4M = 4 and <= 2e30 M/);
    expect(traceRay(2e30, 1).fate).toBe("escaped");
  });

  it("handles an empty bundle", () => {
    // edge case (common practice)
    const bundle = traceRayBundle(new Float64Array(0), 1);
    expect(bundle.xy.length).toBe(0);
    expect(bundle.samples).toBe(512);
  });
});

describe("traceBoundOrbit", () => {
  const periastron = loadFixture<{ rows: { pOverM: number; e: number; advance: string; radialPeriod: string }[] }>("periastron.json");

  it("integrates the periastron advance and radial period of the exact orbit", () => {
    // fixture from tests/fixtures/generate_physics.py: mpmath quadrature of the bound-orbit integrals
    let worstAdvance = 0;
    let worstPeriod = 0;
    for (const row of periastron.rows.filter((r) => r.e > 0)) {
      const orbit = traceBoundOrbit(row.pOverM, row.e, 1);
      worstAdvance = Math.max(worstAdvance, relativeError(orbit.periastronAdvance, Number(row.advance)));
      worstPeriod = Math.max(worstPeriod, relativeError(orbit.radialPeriod, Number(row.radialPeriod)));
      expect(relativeError(orbit.periastronAdvanceExact, Number(row.advance))).toBeLessThan(1e-15);
    }
    console.info(`traceBoundOrbit: largest relative error of the advance ${worstAdvance.toExponential(2)}, radial period ${worstPeriod.toExponential(2)}, at rtol 1e-10`);
    expect(worstAdvance).toBeLessThan(1e-15);
    expect(worstPeriod).toBeLessThan(1e-15);
  });

  it("keeps its accuracy near the separatrix and at high eccentricity", () => {
    // fixture from tests/fixtures/generate_physics.py: mpmath quadrature at 50 digits, cross-checked
    // with elliprf. Integrating the orbit equation in phi was off by 7e-5 rad per orbit at p = 7.01 M,
    // e = 0.5 and by 0.08 rad at p = 6.0021 M, e = 0.001, at rtol 1e-10
    const separatrix = loadFixture<{ orbits: { pOverM: number; e: number; advance: string; radialPeriod: string }[] }>("separatrix-orbits.json");
    let worstAdvance = 0;
    let worstPeriod = 0;
    for (const row of separatrix.orbits) {
      const orbit = traceBoundOrbit(row.pOverM, row.e, 1);
      worstAdvance = Math.max(worstAdvance, relativeError(orbit.periastronAdvance, Number(row.advance)));
      worstPeriod = Math.max(worstPeriod, relativeError(orbit.radialPeriod, Number(row.radialPeriod)));
    }
    console.info(`traceBoundOrbit near the separatrix: largest relative error of the advance ${worstAdvance.toExponential(2)}, radial period ${worstPeriod.toExponential(2)}`);
    expect(worstAdvance).toBeLessThan(2e-15);
    expect(worstPeriod).toBeLessThan(2e-15);
  });

  it("samples the path uniformly in angle with times that grow, and closes each orbit at periastron", () => {
    // r = p/(1 + e cos chi) at periastron (Darwin 1961); t(phi) increases along a bound orbit
    const p = 6.0021;
    const e = 0.001;
    const orbit = traceBoundOrbit(p, e, 1, { orbits: 2, samples: 4001 });
    const sweep = 2 * Math.PI + orbit.periastronAdvance;
    for (let i = 1; i < orbit.count; i++) expect(orbit.t[i]).toBeGreaterThan(orbit.t[i - 1]);
    const end = orbit.count - 1;
    expect(radiusAt(orbit.xy, end)).toBeCloseTo(p / (1 + e), 12);
    expect(Math.atan2(orbit.xy[2 * end + 1], orbit.xy[2 * end])).toBeCloseTo(Math.atan2(Math.sin(2 * sweep), Math.cos(2 * sweep)), 9);
    expect(orbit.t[end]).toBeCloseTo(2 * orbit.radialPeriod, 8);
    // the whirl: ~78 turns per radial period near r = 6 M
    expect(orbit.periastronAdvance / (2 * Math.PI)).toBeGreaterThan(70);
  });

  it("starts at periastron and reaches apastron p/(1-e)", () => {
    // orbit shape r = p/(1 + e cos chi) at the turning points (Darwin 1961)
    const orbit = traceBoundOrbit(40, 0.5, 1, { orbits: 1, samples: 4001 });
    expect(orbit.xy[0]).toBeCloseTo(40 / 1.5, 12);
    expect(orbit.xy[1]).toBe(0);
    let largest = 0;
    for (let i = 0; i < orbit.count; i++) largest = Math.max(largest, Math.hypot(orbit.xy[2 * i], orbit.xy[2 * i + 1]));
    expect(largest).toBeCloseTo(80, 4);
    expect(orbit.periastronAdvanceFirstOrder).toBeCloseTo((6 * Math.PI) / 40, 15);
  });

  it("rejects unstable, unbound and circular orbits", () => {
    // separatrix p = (6 + 2e) M (Cutler, Kennefick & Poisson 1994); e = 0 has no periastron to time
    expect(() => traceBoundOrbit(6.5, 0.5, 1)).toThrow(/p must be finite and > \(6 \+ 2e\) M/);
    expect(() => traceBoundOrbit(20, 1, 1)).toThrow(/eccentricity must be in \(0, 1\)/);
    expect(() => traceBoundOrbit(20, 0, 1)).toThrow(RangeError);
    expect(() => traceBoundOrbit(NaN, 0.3, 1)).toThrow(/p must be/);
    expect(() => traceBoundOrbit(20, 0.3, 1, { orbits: 0 })).toThrow(/options.orbits/);
  });
});
