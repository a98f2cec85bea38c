/**
 * When the form holds a sketch that does not parse or compute, the results on screen are the last
 * valid sketch's: the page dims them and says so in these words.
 */

import type { ComputedSketch } from "./compute-results";
import type { ParsedSketch } from "./parse-sketch";

export const STALE_RESULTS_TEXT =
  "The results, verdicts and plots below belong to the last valid sketch, not to what the form shows now. Fix the field marked in red to update them.";

export const STALE_PLOTS_TEXT = "These plots belong to the last valid sketch, not to the form.";

/** True when the shown results cannot be this sketch's: a field does not parse, or the sketch does not compute. */
export function isStaleSketch(parsed: ParsedSketch, computed: ComputedSketch | undefined): boolean {
  return !parsed.ok || computed?.ok === false;
}
