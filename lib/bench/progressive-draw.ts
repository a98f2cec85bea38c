/**
 * Splits drawing a bundle across animation frames. Under software WebGL (headless Chromium), a WebGL
 * canvas is read back at every frame shown, on the thread that draws it (the view's worker), which so
 * waits there for all the frame's GPU work: drawn whole in one frame, a 5,000-ray bundle held that
 * thread for over a second, and the view could not follow a drag meanwhile. Drawn a bounded number of
 * segments per frame onto the preserved drawing buffer, no frame waits long. Each frame takes the same
 * share of every fate's group, so a partly drawn bundle (or the first frame alone, redrawn while the
 * view is dragged) shows every fate spread over the whole bundle.
 */

/** A range of index entries drawn with one material, as three.js's BufferGeometry groups take it. */
export interface DrawGroup {
  start: number;
  count: number;
  materialIndex: number;
}

/**
 * Line segments drawn per frame (in the view's worker). On the 2-core test machine under load (load
 * average 6-9), a frame of the 5,000-ray demo bundle took the worker 23–51 ms at 8,000 segments (the
 * first, which also uploads the bundle, about 120 ms) and 64–187 ms at 16,000, too slow to follow a
 * drag; at 4,000 every frame's fixed cost (readback, frame pacing) made the whole drawing slower
 * (median click to drawn 1.26–1.35 s against 1.02 s). Each frame holds a spread-out share of the
 * rays (see assemble-bundle), so its pixels, like its segments, are about the bundle's over the frames.
 */
export const SEGMENTS_PER_FRAME = 8000;

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
