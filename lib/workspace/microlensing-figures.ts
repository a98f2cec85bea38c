/**
 * The microlensing quantities of a target that the target page lists beside its stored columns: the
 * peak magnification A(u0) for a point source and, with the source's size, for its disk; the
 * microlens parallax π_E; the largest astrometric shift θ_E/√8; the photon ring. All from the lens
 * solution and the event timing the science cases read (`lib/workspace/derived.ts`).
 */
import { FINITE_SOURCE_METHOD } from "@/lib/lensing/finite-source";
import { peakMagnification } from "@/lib/lensing/microlensing";
import { eventTimingOf, lensSolutionOf } from "@/lib/workspace/derived";
import type { LensHypothesis } from "@/lib/workspace/target-schema";

export interface MicrolensingFigures {
  /** A(u0) of a point source (Paczyński 1986); null at u0 = 0, where it has no finite value. */
  pointSourcePeak: number | null;
  /** A(u0) of the source's disk, with ρ, the limb-darkening coefficient and the method; null without a source size. */
  finiteSourcePeak: { magnification: number; rho: number; limbDarkeningU: number; method: string } | null;
  microlensParallax: number | null;
  maxAstrometricShiftRad: number | null;
  photonRingDiameterRad: number | null;
}

/** The figures of a compact lens's event; null for a hypothesis without a solution or a lens with no event (an extended lens). */
export function microlensingFigures(h: LensHypothesis, solved = lensSolutionOf(h)): MicrolensingFigures | null {
  if (solved === null || solved.solution.maxAstrometricShiftRad === null) return null;
  const { solution, geometry } = solved;
  const event = eventTimingOf(h, solution, geometry);
  const u0 = solution.sourceOffsetThetaE;
  const rho = event.sourceRadiusThetaE;
  return {
    pointSourcePeak: u0 > 0 ? peakMagnification(u0) : null,
    finiteSourcePeak: rho === null ? null : { magnification: peakMagnification(u0, rho, event.limbDarkeningU), rho, limbDarkeningU: event.limbDarkeningU, method: FINITE_SOURCE_METHOD },
    microlensParallax: solution.microlensParallax,
    maxAstrometricShiftRad: solution.maxAstrometricShiftRad,
    photonRingDiameterRad: solution.photonRingDiameterRad,
  };
}
