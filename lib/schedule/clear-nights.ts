/**
 * The clear-night fraction as a fixed pattern of lost nights, so the same inputs always give the same
 * schedule (our rule, no random draw).
 */

/** Guards the floor against rounding when i·f is a whole number (0.7 × 10 computes as 6.999…). */
const ROUNDING_GUARD = 1e-9;

/**
 * Whether night `nightIndex` (0 for the cycle's first) is clear when a share `clearNightFraction`
 * (in (0, 1]) of nights is: night i is clear iff ⌊(i+1)·f⌋ > ⌊i·f⌋ (our rule). The first N nights then
 * hold exactly ⌊N·f⌋ clear nights, spread evenly (with f = 0.5 every second night, with f = 1 all);
 * the lost nights are the same for every target of the site, as weather is.
 */
export function isClearNight(nightIndex: number, clearNightFraction: number): boolean {
  return Math.floor((nightIndex + 1) * clearNightFraction + ROUNDING_GUARD) > Math.floor(nightIndex * clearNightFraction + ROUNDING_GUARD);
}
