/**
 * The caution every view that could lead someone to point optics near the Sun shows, in one wording:
 * the sky view's too-close nights, the bench's solar sketches and the calendar's events (common
 * practice; the observatory's own rules come first).
 */
export const SUN_POINTING_CAUTION =
  "Never point a telescope, finder, camera or binoculars at or near the Sun without a proper solar filter, and follow the observatory's procedures for solar observing.";
