import { describe, expect, it } from "vitest";
import { MAX_FRAME_SEGMENTS, MIN_FRAME_SEGMENTS, TARGET_FRAME_COST_MS, nextFrameSegments, segmentTotal, shareOfGroups } from "@/lib/ray-view/progressive-draw";

const groups = [
  { start: 0, count: 2 * 1000 },
  { start: 2000, count: 2 * 37 },
  { start: 2074, count: 0 },
  { start: 2074, count: 2 * 5 },
];
const total = segmentTotal(groups);

/** The shares of consecutive frames whose sizes are `sizes` (the last one finishing the bundle). */
function sharesOf(sizes: number[]) {
  const shares = [];
  let from = 0;
  for (const size of sizes) {
    const to = Math.min(total, from + size);
    shares.push({ size: to - from, share: shareOfGroups(groups, from, to, total) });
    from = to;
  }
  expect(from).toBe(total);
  return shares;
}

describe("shareOfGroups", () => {
  it("counts the segments of every group", () => {
    expect(total).toBe(1042);
  });

  it("covers every group exactly once, in whole segments, however the frames are sized", () => {
    for (const sizes of [[100, 100, 100, 100, 100, 100, 100, 100, 100, 100, 100], [1, 7, 300, 13, 500, 221], [1042]]) {
      const shares = sharesOf(sizes).map(({ share }) => share);
      groups.forEach((group, materialIndex) => {
        let next = group.start;
        for (const slice of shares.flat().filter((candidate) => candidate.materialIndex === materialIndex)) {
          expect(slice.start).toBe(next);
          expect(slice.count % 2).toBe(0);
          next += slice.count;
        }
        expect(next).toBe(group.start + group.count);
      });
    }
  });

  it("bounds the segments of every share and gives each a part of every fate", () => {
    for (const { size, share } of sharesOf([100, 250, 100, 400, 192])) {
      const segments = share.reduce((sum, slice) => sum + slice.count / 2, 0);
      expect(segments).toBeLessThanOrEqual(size + groups.length);
      expect(share.some((slice) => slice.materialIndex === 1)).toBe(true);
    }
  });

  it("draws a small bundle in one share, and nothing of an empty one", () => {
    expect(shareOfGroups(groups, 0, total, total)).toEqual([
      { start: 0, count: 2000, materialIndex: 0 },
      { start: 2000, count: 74, materialIndex: 1 },
      { start: 2074, count: 10, materialIndex: 3 },
    ]);
    expect(shareOfGroups([{ start: 0, count: 0 }], 0, 0, 0)).toEqual([]);
  });
});

describe("nextFrameSegments", () => {
  it("keeps a share whose frame took the target time", () => {
    expect(nextFrameSegments(4000, TARGET_FRAME_COST_MS)).toBe(4000);
  });

  it("shrinks the share after a slow frame, by at most half (a regression: fixed shares gave 55–77 ms frames on a busy machine)", () => {
    expect(nextFrameSegments(4000, 1.5 * TARGET_FRAME_COST_MS)).toBe(Math.round(4000 / 1.5));
    expect(nextFrameSegments(4000, 10 * TARGET_FRAME_COST_MS)).toBe(2000);
  });

  it("grows the share after a quick frame, by at most half as much again", () => {
    expect(nextFrameSegments(4000, TARGET_FRAME_COST_MS / 1.25)).toBe(5000);
    expect(nextFrameSegments(4000, 1)).toBe(6000);
  });

  it("stays within its bounds and ignores a time that was not measured", () => {
    expect(nextFrameSegments(MIN_FRAME_SEGMENTS, 1000)).toBe(MIN_FRAME_SEGMENTS);
    expect(nextFrameSegments(MAX_FRAME_SEGMENTS, 1)).toBe(MAX_FRAME_SEGMENTS);
    expect(nextFrameSegments(4000, 0)).toBe(4000);
    expect(nextFrameSegments(4000, Number.NaN)).toBe(4000);
  });
});
