import type { Verdict } from "@/lib/lensing/feasibility-rules";
import { DEFAULT_SIGNIFICANT_DIGITS, formatSignificant } from "@/lib/numbers/significant";

export { verdictLabels } from "@/lib/workspace/case-verdict-words";

/** A value with its unit (significant digits as `formatSignificant` writes them), or a bare "—" when there is no value. */
export function formatWithUnit(value: number | null | undefined, unit: string, digits = DEFAULT_SIGNIFICANT_DIGITS): string {
  const text = formatSignificant(value, digits);
  return text === "—" ? text : `${text} ${unit}`;
}

export const verdictClass: Record<Verdict, string> = {
  feasible: "text-glint",
  marginal: "text-ember",
  infeasible: "text-alarm",
  unknown: "text-dusk-dim",
};

export function formatDateTime(iso: string): string {
  return new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" }) + " UTC";
}
