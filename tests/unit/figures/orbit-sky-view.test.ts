import { describe, expect, it } from "vitest";
import { orbitingStar } from "@/db/seed/demo-scenario";
import { orbitSkyView } from "@/lib/figures/orbit-sky-view";
import { relativisticOrbitOf, type RelativisticOrbit, type SkyPoint } from "@/lib/lensing/relativistic-orbit";
import { orbitInputsOf } from "@/lib/workspace/derived";

/** The demo's invented star (a = 700 au, e = 0.93 about 5.2 × 10⁶ M☉ at 8.3 kpc): an advance of about 35′ per orbit. */
function demoOrbit(): RelativisticOrbit {
  const outcome = relativisticOrbitOf(orbitInputsOf({ ...orbitingStar, scienceCase: "relativistic-orbit" }, { dLensPc: 8300, dSourcePc: 9000, dLensSourcePc: 700, zLens: 0 }));
  if ("missing" in outcome) throw new Error(outcome.missing);
  return outcome.orbit;
}

const gap = (p: SkyPoint, q: SkyPoint) => Math.hypot(p.eastMas - q.eastMas, p.northMas - q.northMas);

describe("orbitSkyView", () => {
  it("magnifies the precession by a round factor, its departure from the ellipse times the factor point by point", () => {
    const orbit = demoOrbit();
    const view = orbitSkyView(orbit)!;
    expect([1, 2, 5, 10, 20, 50, 100, 200, 500, 1000]).toContain(view.magnification);
    expect(view.magnification).toBeGreaterThan(1);
    const last = view.magnified.length - 1;
    // The advanced periapsis: the exact track's last point, its shift from the first periapsis multiplied.
    expect(gap(view.advancedPeriapsis, view.periapsis)).toBeCloseTo(view.magnification * gap(orbit.skyPrecessing![last], orbit.skyNewtonian![0]), 9);
    expect(gap(view.magnified[0], view.newtonian[0])).toBeLessThan(1e-9 * gap(view.apoapsis, view.periapsis));
  });

  it("draws north up and east to the left on one scale, the whole of every track inside the frame", () => {
    const view = orbitSkyView(demoOrbit())!;
    const [eastLeft, eastRight] = view.eastDomainMas;
    const [northLow, northHigh] = view.northDomainMas;
    expect(eastLeft).toBeGreaterThan(eastRight);
    expect(eastLeft - eastRight).toBeCloseTo(northHigh - northLow, 9);
    for (const p of [...view.newtonian, ...view.precessing, ...view.magnified, { eastMas: 0, northMas: 0 }]) {
      expect(p.eastMas).toBeLessThan(eastLeft);
      expect(p.eastMas).toBeGreaterThan(eastRight);
      expect(p.northMas).toBeGreaterThan(northLow);
      expect(p.northMas).toBeLessThan(northHigh);
    }
  });

  it("is null without sky tracks (no distance or orientation)", () => {
    expect(orbitSkyView({ skyNewtonian: null, skyPrecessing: null })).toBeNull();
  });
});
