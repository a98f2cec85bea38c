import { describe, expect, it } from "vitest";
import { einsteinRadius, pointLensImages } from "@/lib/physics/point-lens";
import { virbhadraEllisImages } from "@/lib/physics/strong-lens";
import { loadFixture, relativeError } from "./fixtures";

interface FixtureImage {
  thetaRad: string;
  magnification: string;
  thetaMinusThetaInfRad: string;
}
interface VirbhadraEllisFixture {
  rows: {
    betaRad: number;
    massSolar: number;
    dLensPc: number;
    dSourcePc: number;
    thetaInfinityRad: string;
    images: Record<"primary" | "secondary" | "relativisticPrimary" | "relativisticSecondary", FixtureImage>;
  }[];
}
const fixture = loadFixture<VirbhadraEllisFixture>("virbhadra-ellis.json");
interface WideAngleFixture {
  rows: (Omit<VirbhadraEllisFixture["rows"][number], "images"> & {
    images: Partial<Record<"primary" | "secondary" | "relativisticPrimary" | "relativisticSecondary", FixtureImage & { thetaMinusBetaRad: string; magnificationMinusOne: string }>>;
  })[];
}
const wideAngle = loadFixture<WideAngleFixture>("wide-angle-images.json");

describe("virbhadraEllisImages", () => {
  it("matches the mpmath solution of the exact lens equation", () => {
    // fixture from tests/fixtures/generate_physics.py, mpmath findroot + diff at 40 digits
    let worstTheta = 0;
    let worstOffset = 0;
    let worstMagnification = 0;
    for (const row of fixture.rows) {
      const result = virbhadraEllisImages(row.betaRad, row.massSolar, row.dLensPc, row.dSourcePc);
      expect(relativeError(result.thetaInfinityRad, Number(row.thetaInfinityRad))).toBeLessThan(1e-14);
      for (const name of ["primary", "secondary", "relativisticPrimary", "relativisticSecondary"] as const) {
        const image = result[name];
        const expected = row.images[name];
        worstTheta = Math.max(worstTheta, relativeError(image.thetaRad, Number(expected.thetaRad)));
        worstMagnification = Math.max(worstMagnification, relativeError(image.magnification, Number(expected.magnification)));
        if (name.startsWith("relativistic")) {
          worstOffset = Math.max(worstOffset, relativeError(Math.abs(image.thetaRad) - result.thetaInfinityRad, Number(expected.thetaMinusThetaInfRad)));
        }
      }
    }
    console.info(`virbhadraEllisImages: largest relative errors theta ${worstTheta.toExponential(2)}, theta - theta_inf ${worstOffset.toExponential(2)}, magnification ${worstMagnification.toExponential(2)}`);
    expect(worstTheta).toBeLessThan(1e-15);
    expect(worstOffset).toBeLessThan(1e-11);
    expect(worstMagnification).toBeLessThan(1e-10);
  });

  it("puts the primary image of a source far from the lens beyond it, magnified", () => {
    // fixture from tests/fixtures/generate_physics.py: mpmath findroot and diff at 70 digits, beta up to
    // 0.49 rad. The tangent form cancelled to ~1e-14 and gave theta - beta < 0 and mu < 1 at beta = 0.4
    for (const row of wideAngle.rows) {
      const primary = virbhadraEllisImages(row.betaRad, row.massSolar, row.dLensPc, row.dSourcePc).primary;
      const expected = row.images.primary!;
      expect(primary.thetaRad).toBeGreaterThanOrEqual(row.betaRad);
      expect(primary.magnification).toBeGreaterThanOrEqual(1);
      // theta within one ulp (theta - beta itself may be below one ulp of theta)
      expect(Math.abs(primary.thetaRad - row.betaRad - Number(expected.thetaMinusBetaRad))).toBeLessThanOrEqual(Number.EPSILON * primary.thetaRad);
      expect(Math.abs(primary.magnification - 1 - Number(expected.magnificationMinusOne))).toBeLessThanOrEqual(Number.EPSILON);
    }
  });

  it("matches mpmath for all four images of a solar-mass lens at beta = 1e-3 rad", () => {
    // fixture as above; theta - beta of the primary is 2.4e-14 rad there, mu - 1 is 5.7e-22
    const row = wideAngle.rows.find((r) => r.betaRad === 1e-3)!;
    const result = virbhadraEllisImages(row.betaRad, row.massSolar, row.dLensPc, row.dSourcePc);
    for (const name of ["primary", "secondary", "relativisticPrimary", "relativisticSecondary"] as const) {
      expect(relativeError(result[name].thetaRad, Number(row.images[name]!.thetaRad))).toBeLessThan(1e-14);
      expect(relativeError(result[name].magnification, Number(row.images[name]!.magnification))).toBeLessThan(1e-10);
    }
    expect(relativeError(result.primary.thetaRad - row.betaRad, Number(row.images.primary!.thetaMinusBetaRad))).toBeLessThan(1e-5);
  });

  it("reduces to the weak-field point lens for the outer images", () => {
    // Paczynski 1986 images in units of theta_E; the exact equation differs at O(theta_E) ~ 1e-5
    const [beta, mass, dL, dS] = [2e-6, 4.3e6, 8300, 16600];
    const thetaE = einsteinRadius(mass, dL, dS);
    const weak = pointLensImages(beta / thetaE);
    const exact = virbhadraEllisImages(beta, mass, dL, dS);
    expect(relativeError(exact.primary.thetaRad / thetaE, weak.thetaPlus)).toBeLessThan(1e-4);
    expect(relativeError(exact.secondary.thetaRad / thetaE, weak.thetaMinus)).toBeLessThan(1e-4);
    expect(relativeError(exact.primary.magnification, weak.magnificationPlus)).toBeLessThan(1e-4);
    expect(relativeError(exact.secondary.magnification, weak.magnificationMinus)).toBeLessThan(1e-4);
  });

  it("puts the first relativistic images where Bozza's strong-deflection limit does", () => {
    // Bozza 2002, Phys. Rev. D 66, 103001: theta_1 = theta_inf (1 + e_1), e_1 = exp(bbar - 2 pi),
    // bbar = -0.4002, and mu_1 = e_1 (1 + e_1) D_S theta_inf^2 / (abar beta D_LS) (from memory)
    const [beta, mass, dL, dS] = [1e-6, 2.8e6, 8500, 17000];
    const result = virbhadraEllisImages(beta, mass, dL, dS);
    const e1 = Math.exp(Math.log(216 * (7 - 4 * Math.sqrt(3))) - Math.PI - 2 * Math.PI);
    const thetaInf = result.thetaInfinityRad;
    expect(relativeError(result.relativisticPrimary.thetaRad, thetaInf * (1 + e1))).toBeLessThan(1e-5);
    expect(relativeError(-result.relativisticSecondary.thetaRad, thetaInf * (1 + e1))).toBeLessThan(1e-5);
    const muBozza = (e1 * (1 + e1) * dS * thetaInf * thetaInf) / (beta * (dS - dL));
    expect(relativeError(result.relativisticPrimary.magnification, muBozza)).toBeLessThan(1e-2);
    expect(result.relativisticPrimary.deflectionRad).toBeCloseTo(2 * Math.PI, 4);
  });

  it("gives an Einstein ring of infinite magnification at beta = 0 and rejects bad input", () => {
    // perfect alignment (Virbhadra & Ellis 2000): theta_+ = -theta_-, magnification diverges
    const ring = virbhadraEllisImages(0, 4.3e6, 8300, 16600);
    expect(ring.primary.thetaRad).toBeCloseTo(-ring.secondary.thetaRad, 18);
    expect(ring.primary.magnification).toBe(Infinity);
    expect(ring.secondary.magnification).toBe(-Infinity);
    expect(() => virbhadraEllisImages(NaN, 1, 1, 2)).toThrow(/sourceAngleRad/);
    expect(() => virbhadraEllisImages(1e-6, 1, 2, 1)).toThrow(/dLensSourcePc/);
    expect(() => virbhadraEllisImages(1e-6, -1, 1, 2)).toThrow(/massSolar/);
  });
});
