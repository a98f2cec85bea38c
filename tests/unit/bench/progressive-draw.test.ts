import { describe, expect, it } from "vitest";
import { progressiveFrames } from "@/lib/bench/progressive-draw";

const groups = [
  { start: 0, count: 2 * 1000 },
  { start: 2000, count: 2 * 37 },
  { start: 2074, count: 0 },
  { start: 2074, count: 2 * 5 },
];

describe("progressiveFrames", () => {
  it("covers every group exactly once, in whole segments", () => {
    const frames = progressiveFrames(groups, 100);
    groups.forEach((group, materialIndex) => {
      const slices = frames.flat().filter((slice) => slice.materialIndex === materialIndex);
      let next = group.start;
      for (const slice of slices) {
        expect(slice.start).toBe(next);
        expect(slice.count % 2).toBe(0);
        next += slice.count;
      }
      expect(next).toBe(group.start + group.count);
    });
  });

  it("bounds the segments of every frame and gives each frame a share of every fate", () => {
    const frames = progressiveFrames(groups, 100);
    expect(frames).toHaveLength(Math.ceil(1042 / 100));
    for (const frame of frames) {
      const segments = frame.reduce((sum, slice) => sum + slice.count / 2, 0);
      expect(segments).toBeLessThanOrEqual(100 + groups.length);
      expect(frame.some((slice) => slice.materialIndex === 1)).toBe(true);
    }
  });

  it("draws a small bundle in one frame, and an empty one in one empty frame", () => {
    expect(progressiveFrames(groups, 10_000)).toEqual([
      [
        { start: 0, count: 2000, materialIndex: 0 },
        { start: 2000, count: 74, materialIndex: 1 },
        { start: 2074, count: 10, materialIndex: 3 },
      ],
    ]);
    expect(progressiveFrames([{ start: 0, count: 0 }], 100)).toEqual([[]]);
  });
});
