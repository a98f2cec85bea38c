/**
 * Splits drawing a bundle across animation frames. Under software WebGL (headless Chromium), the
 * compositor reads the canvas back on the main thread at every commit and so waits there for all the
 * frame's GPU work: drawing a whole 5,000-ray bundle in one frame blocked the page for over a second.
 * Drawn a bounded number of segments per frame onto the preserved drawing buffer, no frame waits long.
 * Each frame takes the same share of every fate's group, so a partly drawn bundle (or the first frame
 * alone, redrawn while the view is dragged) shows every fate spread over the whole bundle.
 */

/** A range of index entries drawn with one material, as three.js's BufferGeometry groups take it. */
export interface DrawGroup {
  start: number;
  count: number;
  materialIndex: number;
}

/**
 * Line segments drawn per frame. On the 2-core test machine (under load) a frame of the 5,000-ray demo
 * bundle took 26–123 ms of software rasterizing at 16,000 segments and 38–67 ms at 8,000: filling the
 * blended pixels costs more than setting up the segments. Each frame holds a spread-out share of the
 * rays (see assemble-bundle), so its pixels, like its segments, are about the bundle's over the frames.
 */
export const SEGMENTS_PER_FRAME = 4000;

/** Index entries per line segment. */
const ENTRIES_PER_SEGMENT = 2;

/**
 * The groups to draw in each frame, in order; together they cover every group exactly once and no
 * frame holds more than `segmentsPerFrame` segments plus one per group (rounding). At least one frame.
 */
export function progressiveFrames(groups: readonly { start: number; count: number }[], segmentsPerFrame: number = SEGMENTS_PER_FRAME): DrawGroup[][] {
  const segments = groups.map((group) => group.count / ENTRIES_PER_SEGMENT);
  const total = segments.reduce((sum, count) => sum + count, 0);
  const frameCount = Math.max(1, Math.ceil(total / segmentsPerFrame));
  // Where frame k starts within a group of n segments: whole segments, the last frame ending at n.
  const boundary = (n: number, k: number) => ENTRIES_PER_SEGMENT * Math.floor((n * k) / frameCount);
  const frames: DrawGroup[][] = [];
  for (let k = 0; k < frameCount; k++) {
    const frame: DrawGroup[] = [];
    groups.forEach((group, materialIndex) => {
      const from = boundary(segments[materialIndex], k);
      const to = boundary(segments[materialIndex], k + 1);
      if (to > from) frame.push({ start: group.start + from, count: to - from, materialIndex });
    });
    frames.push(frame);
  }
  return frames;
}
