/** Bounds of a PNG export: wide enough for a poster at 300 DPI, small enough to render in about a second. */
export const MIN_PNG_WIDTH_PX = 200;
export const MAX_PNG_WIDTH_PX = 8000;
export const MIN_PNG_DPI = 72;
export const MAX_PNG_DPI = 1200;
/**
 * The widest PNG of the open bench export without signing in: a slide or a screen at 2× (the default
 * width), a quarter of the pixels' rendering time of the largest. Wider is for signed-in users.
 */
export const MAX_SIGNED_OUT_PNG_WIDTH_PX = 2000;
