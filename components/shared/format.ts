import type { Verdict } from "@/lib/lensing/feasibility-rules";

export { verdictLabels } from "@/lib/workspace/case-verdict-words";

/** Four significant digits, exponent form for very small or large values; "—" where there is no value. */
export function formatQuantity(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  const magnitude = Math.abs(value);
  if (magnitude !== 0 && (magnitude < 1e-3 || magnitude >= 1e6)) return value.toExponential(digits - 1);
  return Number(value.toPrecision(digits)).toString();
}

/** A value with its unit, or a bare "—" when there is no value. */
export function formatWithUnit(value: number | null | undefined, unit: string, digits = 4): string {
  const text = formatQuantity(value, digits);
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
