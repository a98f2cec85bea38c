/**
 * Matching imported rows to targets the proposal already has, so that importing the same file twice
 * updates instead of duplicating: by name (ignoring case and spaces), else by position within a
 * tolerance the user sees.
 */

const DEG_TO_RAD = Math.PI / 180;
const RAD_TO_ARCSEC = 648_000 / Math.PI;

/** Largest tolerance accepted: one degree; wider would merge unrelated targets. */
export const MAX_MATCH_TOLERANCE_ARCSEC = 3600;

/**
 * Angular separation in arcseconds between two ICRS positions given in degrees, by the Vincenty
 * formula on the sphere (the spherical case of Vincenty 1975, Survey Review 23(176) 88–93): atan2 of
 * the cross and dot terms, accurate to rounding at every separation from 0 to 180°, where the law of
 * cosines loses precision near 0 and the haversine formula near 180°.
 */
export function angularSeparationArcsec(ra1Deg: number, dec1Deg: number, ra2Deg: number, dec2Deg: number): number {
  const deltaRa = (ra2Deg - ra1Deg) * DEG_TO_RAD;
  const phi1 = dec1Deg * DEG_TO_RAD;
  const phi2 = dec2Deg * DEG_TO_RAD;
  const sinDeltaRa = Math.sin(deltaRa);
  const cosDeltaRa = Math.cos(deltaRa);
  const x = Math.cos(phi2) * sinDeltaRa;
  const y = Math.cos(phi1) * Math.sin(phi2) - Math.sin(phi1) * Math.cos(phi2) * cosDeltaRa;
  const z = Math.sin(phi1) * Math.sin(phi2) + Math.cos(phi1) * Math.cos(phi2) * cosDeltaRa;
  return Math.atan2(Math.hypot(x, y), z) * RAD_TO_ARCSEC;
}

/** The form a name is compared in: Unicode-compatible, lower case, without any white space. */
export function nameKey(name: string): string {
  return name.normalize("NFKC").toLowerCase().replace(/\s+/g, "");
}

export interface PositionedTarget {
  id: string;
  name: string;
  raDeg: number;
  decDeg: number;
}

export type TargetMatch = { by: "name"; targetId: string } | { by: "position"; targetId: string; separationArcsec: number };

function checkTolerance(toleranceArcsec: number): void {
  if (!(toleranceArcsec > 0 && toleranceArcsec <= MAX_MATCH_TOLERANCE_ARCSEC)) {
    throw new RangeError(`The match tolerance must be in (0, ${MAX_MATCH_TOLERANCE_ARCSEC}] arcseconds (got ${toleranceArcsec}).`);
  }
}

/**
 * The targets of a proposal, indexed for matching many candidates: by name key, and sorted by
 * declination so that only targets within the tolerance in Dec are measured (a 10,000-row import
 * against thousands of targets stays fast).
 */
export class TargetMatcher {
  private readonly byName = new Map<string, PositionedTarget>();
  private readonly byDec: PositionedTarget[];

  constructor(
    targets: readonly PositionedTarget[],
    private readonly toleranceArcsec: number,
  ) {
    checkTolerance(toleranceArcsec);
    for (const target of targets) if (!this.byName.has(nameKey(target.name))) this.byName.set(nameKey(target.name), target);
    this.byDec = [...targets].sort((a, b) => a.decDeg - b.decDeg);
  }

  /** The target with the same name key; failing that the nearest within the tolerance; else null. */
  match(candidate: { name: string; raDeg: number; decDeg: number }): TargetMatch | null {
    const named = this.byName.get(nameKey(candidate.name));
    if (named) return { by: "name", targetId: named.id };
    const toleranceDeg = this.toleranceArcsec / 3600;
    let best: { target: PositionedTarget; separationArcsec: number } | null = null;
    for (let i = this.firstAtOrAbove(candidate.decDeg - toleranceDeg); i < this.byDec.length; i += 1) {
      const target = this.byDec[i];
      if (target.decDeg > candidate.decDeg + toleranceDeg) break;
      const separationArcsec = angularSeparationArcsec(candidate.raDeg, candidate.decDeg, target.raDeg, target.decDeg);
      if (separationArcsec <= this.toleranceArcsec && (best === null || separationArcsec < best.separationArcsec)) best = { target, separationArcsec };
    }
    return best === null ? null : { by: "position", targetId: best.target.id, separationArcsec: best.separationArcsec };
  }

  /** Adds a target (e.g. a row accepted earlier in the same file, so later duplicates match it). */
  add(target: PositionedTarget): void {
    if (!this.byName.has(nameKey(target.name))) this.byName.set(nameKey(target.name), target);
    this.byDec.splice(this.firstAtOrAbove(target.decDeg), 0, target);
  }

  /** Index of the first target with decDeg ≥ `decDeg` (binary search). */
  private firstAtOrAbove(decDeg: number): number {
    let low = 0;
    let high = this.byDec.length;
    while (low < high) {
      const middle = (low + high) >>> 1;
      if (this.byDec[middle].decDeg < decDeg) low = middle + 1;
      else high = middle;
    }
    return low;
  }
}
