/** Resolutions the ray view saves at, as multiples of its size on screen (for print and slides). */
export const PNG_SCALES = [1, 2, 4] as const;
export type PngScale = (typeof PNG_SCALES)[number];
