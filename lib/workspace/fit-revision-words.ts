/**
 * A fit revision in words: each field a fit sets, its value as the product writes it elsewhere
 * (t0 by `formatEventPeak`, spans by `daysWords`, numbers by `numberWords`), and the sentences of
 * the activity feed. Shared by the data access (the feed's entries) and the revisions list.
 */
import { standardBand } from "@/lib/photometry/bands";
import { daysWords, numberWords } from "@/lib/lensing/science-case-words";
import { formatEventPeak } from "@/lib/workspace/event-peak";
import { CUSTOM_BAND_ID } from "@/lib/workspace/photometry-schema";
import { fitRevisionFields, type FitRevisionField, type FitRevisionValues, type FitSummary } from "@/lib/workspace/fit-revision";
import { formatSignificant } from "@/lib/numbers/significant";

/** Each field as the revisions list names it. */
export const fitRevisionFieldLabels: Record<FitRevisionField, string> = {
  eventPeakJdUtc: "Event peak t0",
  sourceOffsetThetaE: "Impact parameter u0",
  einsteinTimeDays: "Einstein time t_E",
  sourceRadiusThetaE: "Source radius ρ",
  parallaxNorth: "Microlens parallax π_E,N",
  parallaxEast: "Microlens parallax π_E,E",
  sourceMagnitude: "Source magnitude",
  sourceBand: "Source band",
  blendFraction: "Blend fraction f_s",
};

/** What an empty field means, per field: t_E then follows θ_E/μ_rel; an empty band is the proposal's. */
const emptyWords: Record<FitRevisionField, string> = {
  eventPeakJdUtc: "not set",
  sourceOffsetThetaE: "not set",
  einsteinTimeDays: "from θ_E / μ_rel",
  sourceRadiusThetaE: "not set",
  parallaxNorth: "not set",
  parallaxEast: "not set",
  sourceMagnitude: "not set",
  sourceBand: "the proposal's band",
  blendFraction: "not set",
};

function bandWords(bandId: string): string {
  if (bandId === CUSTOM_BAND_ID) return "the proposal's own band";
  return standardBand(bandId)?.label ?? bandId;
}

/** One field's value in words: "2031-06-13 10:04 UTC (JD 2463020.92)", "27.6 d", "19.12 mag". */
export function fitRevisionValueWords(field: FitRevisionField, value: number | string | null): string {
  if (value === null) return emptyWords[field];
  if (typeof value === "string") return bandWords(value);
  switch (field) {
    case "eventPeakJdUtc":
      return formatEventPeak(value);
    case "einsteinTimeDays":
      return daysWords(value);
    // Magnitudes to the hundredth, as photometry quotes them (common practice).
    case "sourceMagnitude":
      return `${formatSignificant(value, 4)} mag`;
    default:
      return numberWords(value);
  }
}

/** The fields whose values differ between two sets, in the contract's order. */
export function changedFields(before: FitRevisionValues, after: FitRevisionValues): FitRevisionField[] {
  return fitRevisionFields.filter((field) => before[field] !== after[field]);
}

/** "t0 2031-06-13 10:04 UTC (JD 2463020.92), u0 0.081, t_E 27.6 d": what an event's timing is after a revision. */
function timingWords(values: FitRevisionValues): string {
  const t0 = values.eventPeakJdUtc;
  return [
    `t0 ${t0 === null ? "not set" : fitRevisionValueWords("eventPeakJdUtc", t0)}`,
    `u0 ${fitRevisionValueWords("sourceOffsetThetaE", values.sourceOffsetThetaE)}`,
    `t_E ${fitRevisionValueWords("einsteinTimeDays", values.einsteinTimeDays)}`,
  ].join(", ");
}

/** The feed's subject of an applied fit: "Cinder Avocet: t0 …, u0 0.081, t_E 27.6 d (χ²/dof 1.02, 412 points)". */
export function fitAppliedWords(targetName: string, after: FitRevisionValues, summary: Pick<FitSummary, "chi2" | "dof" | "pointCount">): string {
  return `${targetName}: ${timingWords(after)} (χ²/dof ${numberWords(summary.chi2 / summary.dof)}, ${summary.pointCount} points)`;
}

/** The feed's subject of an undone fit: "Cinder Avocet, back to t0 …, u0 0.3, t_E from θ_E / μ_rel". */
export function fitUndoneWords(targetName: string, restored: FitRevisionValues): string {
  return `${targetName}, back to ${timingWords(restored)}`;
}
