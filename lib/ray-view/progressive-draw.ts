/**
 * Splits drawing a bundle across animation frames. Under software WebGL (headless Chromium), the
 * compositor reads the canvas back on the main thread at every commit and so waits there for all the
 * frame's GPU work: drawing a whole 5,000-ray bundle in one frame blocked the page for over a second.
 * Drawn a bounded number of segments per frame onto the preserved drawing buffer, no frame waits long.
 * Each frame takes the same share of every fate's group, so a partly drawn bundle (or the first frame
 * alone, redrawn while the view is dragged) shows every fate spread over the whole bundle.
 *
 * How many segments a frame can hold depends on the machine and on what else runs on it: on the
 * 2-core test machine a frame of the demo bundle took 38–67 ms at 8,000 segments when quiet, and
 * 4,000-segment frames took 51–117 ms while a second browser rasterized beside it. So the share is
 * steered by the measured cost of each frame (`nextFrameSegments`) rather than fixed.
 */

/** A range of index entries drawn with one material, as three.js's BufferGeometry groups take it. */
export interface DrawGroup {
  start: number;
  count: number;
  materialIndex: number;
}

/** Segments in a view's first frame, before any frame has been timed. */
export const FIRST_FRAME_SEGMENTS = 4000;

/**
 * Segments in the first frame of a new bundle, which also copies the bundle's buffers to the GPU
 * (3.4 MB of vertices, line distances and index for the demo bundle): in a Chromium trace on a busy
 * machine, that frame waited 55 ms for the GPU process when it also drew a full share. It is not
 * timed, so it does not shrink the shares after it.
 */
export const UPLOAD_FRAME_SEGMENTS = 500;

/**
 * Bounds of a frame's share, segments. The 5,000-ray demo bundle has 136,845 segments: however slow
 * the machine, it is drawn in at most 137 frames (about 2.3 s at 60 Hz).
 */
export const MIN_FRAME_SEGMENTS = 1000;
export const MAX_FRAME_SEGMENTS = 64_000;

/**
 * Main-thread time a frame's share is steered to, ms. Frames vary: while a second browser rasterized
 * on the same 2 cores, single frames took 2–4 times as long as the one before. Steered to 25 ms, 6 of
 * 10 traces there had a task over 50 ms; at 18 ms, 4 of 10, while a quiet machine still draws the
 * 5,000-ray demo bundle in about 0.4 s.
 */
export const TARGET_FRAME_COST_MS = 18;

/** Most a share may grow from one frame to the next (it may shrink to half at once). */
const MAX_GROWTH = 1.5;

/** Index entries per line segment. */
const ENTRIES_PER_SEGMENT = 2;

/** Segments in the groups (each counted in index entries). */
export function segmentTotal(groups: readonly { count: number }[]): number {
  return groups.reduce((sum, group) => sum + group.count / ENTRIES_PER_SEGMENT, 0);
}

/**
 * The share of every group that lies between `fromSegment` and `toSegment` of `totalSegments`
 * (0 ≤ from ≤ to ≤ total), in whole segments. Consecutive shares cover every group exactly once; a
 * share of s segments holds at most s plus one per group (rounding).
 */
export function shareOfGroups(groups: readonly { start: number; count: number }[], fromSegment: number, toSegment: number, totalSegments: number): DrawGroup[] {
  if (totalSegments <= 0) return [];
  // Where a share starts within a group of n segments: whole segments, the whole group at the end.
  const boundary = (n: number, segment: number) => (segment >= totalSegments ? ENTRIES_PER_SEGMENT * n : ENTRIES_PER_SEGMENT * Math.floor((n * segment) / totalSegments));
  const share: DrawGroup[] = [];
  groups.forEach((group, materialIndex) => {
    const n = group.count / ENTRIES_PER_SEGMENT;
    const from = boundary(n, fromSegment);
    const to = boundary(n, toSegment);
    if (to > from) share.push({ start: group.start + from, count: to - from, materialIndex });
  });
  return share;
}

/**
 * The next frame's share, segments, from the share of the frame just timed and the main-thread time
 * that frame took (ms, from its start to the end of its task, GPU wait included). A frame's cost is
 * about proportional to its segments, so the share is scaled towards the target cost, growing by at
 * most MAX_GROWTH and shrinking to no less than half per frame (one odd frame does not swing it far),
 * within the bounds.
 */
export function nextFrameSegments(timedSegments: number, frameCostMs: number): number {
  if (!(frameCostMs > 0)) return timedSegments;
  const scale = Math.min(MAX_GROWTH, Math.max(0.5, TARGET_FRAME_COST_MS / frameCostMs));
  return Math.min(MAX_FRAME_SEGMENTS, Math.max(MIN_FRAME_SEGMENTS, Math.round(timedSegments * scale)));
}
