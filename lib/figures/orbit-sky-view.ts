/**
 * What the orbit's sky figure draws, computed once from the relativistic orbit (lib/lensing/
 * relativistic-orbit.ts): one period of the star's track on the sky about the compact mass, in mas at
 * the lens distance, as the Newtonian ellipse and the exact precessing orbit, and, because a real
 * advance is a few arcminutes at most, the precessing orbit's departure from the ellipse multiplied
 * by a stated round factor, so the shift can be seen.
 *
 * Axes follow the sky: north up, east to the left (common practice for sky charts), one scale for
 * both axes so the orbit's shape is true.
 */

import type { RelativisticOrbit, SkyPoint } from "@/lib/lensing/relativistic-orbit";

/** Share of the orbit's extent the magnified departure is drawn at (our rule: plainly visible, still clearly the same orbit). */
const MAGNIFIED_DEPARTURE_SHARE = 0.06;
/** Share of the extent left free around the tracks. */
const PADDING_SHARE = 0.08;

export interface OrbitSkyView {
  /** The Newtonian ellipse over one period, periapsis first and last. */
  newtonian: SkyPoint[];
  /** The exact precessing orbit over one radial period: periapsis first, the advanced periapsis last. */
  precessing: SkyPoint[];
  /** The precessing orbit with its departure from the ellipse multiplied by `magnification` (1 when none is needed). */
  magnified: SkyPoint[];
  /** The departure's factor in `magnified`: 1, 2 or 5 × 10ⁿ. */
  magnification: number;
  periapsis: SkyPoint;
  /** The Newtonian apoapsis (the ellipse's middle point) and the advanced periapsis, magnified. */
  apoapsis: SkyPoint;
  advancedPeriapsis: SkyPoint;
  /** Both axes' span, mas: east (drawn increasing to the left) and north, equal in length and centred on the tracks. */
  eastDomainMas: [number, number];
  northDomainMas: [number, number];
}

/** The largest 1, 2 or 5 × 10ⁿ not above `value` (≥ 1). */
function roundFactorBelow(value: number): number {
  if (!(value > 1) || !Number.isFinite(value)) return 1;
  const decade = 10 ** Math.floor(Math.log10(value));
  const steps = [5, 2, 1].map((step) => step * decade);
  return steps.find((step) => step <= value) ?? decade;
}

const distance = (p: SkyPoint, q: SkyPoint) => Math.hypot(p.eastMas - q.eastMas, p.northMas - q.northMas);

/**
 * The sky figure's content, or null when the orbit has no sky tracks (the distance or the
 * orientation not set). The two tracks are sampled alike (the Newtonian at equal steps of true
 * anomaly, the precessing at equal steps of its polar angle over 2π plus the advance), so the k-th
 * points are the same phase of the orbit and their difference is the departure that is magnified.
 */
export function orbitSkyView(orbit: Pick<RelativisticOrbit, "skyNewtonian" | "skyPrecessing">): OrbitSkyView | null {
  const { skyNewtonian: newtonian, skyPrecessing: precessing } = orbit;
  if (newtonian === null || precessing === null || newtonian.length === 0 || newtonian.length !== precessing.length) return null;
  const easts = [...newtonian, ...precessing].map((p) => p.eastMas).concat(0);
  const norths = [...newtonian, ...precessing].map((p) => p.northMas).concat(0);
  const extent = Math.max(Math.max(...easts) - Math.min(...easts), Math.max(...norths) - Math.min(...norths));
  const largestDeparture = Math.max(...newtonian.map((p, k) => distance(p, precessing[k])));
  const magnification = largestDeparture > 0 ? roundFactorBelow((MAGNIFIED_DEPARTURE_SHARE * extent) / largestDeparture) : 1;
  const magnified = newtonian.map((p, k) => ({
    eastMas: p.eastMas + magnification * (precessing[k].eastMas - p.eastMas),
    northMas: p.northMas + magnification * (precessing[k].northMas - p.northMas),
  }));
  const allEast = easts.concat(magnified.map((p) => p.eastMas));
  const allNorth = norths.concat(magnified.map((p) => p.northMas));
  const eastMid = (Math.max(...allEast) + Math.min(...allEast)) / 2;
  const northMid = (Math.max(...allNorth) + Math.min(...allNorth)) / 2;
  const span = Math.max(Math.max(...allEast) - Math.min(...allEast), Math.max(...allNorth) - Math.min(...allNorth)) * (1 + 2 * PADDING_SHARE);
  const half = span > 0 ? span / 2 : 1;
  return {
    newtonian,
    precessing,
    magnified,
    magnification,
    periapsis: newtonian[0],
    apoapsis: newtonian[(newtonian.length - 1) / 2] ?? newtonian[Math.floor(newtonian.length / 2)],
    advancedPeriapsis: magnified[magnified.length - 1],
    eastDomainMas: [eastMid + half, eastMid - half],
    northDomainMas: [northMid - half, northMid + half],
  };
}

/** The figure's title, on the page and in its accessible name. */
export function orbitSkyTitle(targetName: string): string {
  return `The star's orbit about ${targetName} on the sky, one period`;
}
