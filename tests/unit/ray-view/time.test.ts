import { describe, expect, it } from "vitest";
import { FRONT_HEAD_SHARE, frontHeadM, isInFrontHead, isShownAtTime, pathUpToTime, sliderTimeM, sliderTimeText, TIME_RULE_GLSL, TIME_SLIDER_STEPS } from "@/lib/ray-view/time";

describe("the ray view's time slider", () => {
  it("runs from the start to the latest point, its last step showing every path whole", () => {
    expect(sliderTimeM(0, 420)).toBe(0);
    expect(sliderTimeM(TIME_SLIDER_STEPS / 2, 420)).toBe(210);
    expect(sliderTimeM(TIME_SLIDER_STEPS, 420)).toBe(Number.POSITIVE_INFINITY);
    expect(frontHeadM(Number.POSITIVE_INFINITY, 420)).toBe(0);
    expect(frontHeadM(210, 420)).toBeCloseTo(FRONT_HEAD_SHARE * 420, 12);
  });

  it("shows a point once the slider has reached its time, and marks the last stretch as the head", () => {
    expect(isShownAtTime(100, 100)).toBe(true);
    expect(isShownAtTime(100.001, 100)).toBe(false);
    expect(isInFrontHead(95, 100, 10)).toBe(true);
    expect(isInFrontHead(85, 100, 10)).toBe(false);
    expect(isInFrontHead(105, 100, 10)).toBe(false);
    // The shaders use the same comparisons.
    expect(TIME_RULE_GLSL).toMatch(/vertexTime <= timeM/);
    expect(TIME_RULE_GLSL).toMatch(/timeM - vertexTime < headM/);
  });

  it("cuts a path where it stands at the slider's time, a slow stretch (near the mass) cut short", () => {
    // Three points along x; the second stretch is slow (10 M of time for 1 M of path), as near the lens.
    const vertices = new Float32Array([0, 5, 0, 4, 5, 0, 5, 5, 0]);
    const times = new Float32Array([0, 4, 14]);
    expect(pathUpToTime(vertices, times, 0, 3, 2)).toEqual({ shownPoints: 1, tip: [2, 5, 0] });
    // Half the slow stretch's time is a tenth of a length unit per unit of time: x = 4.5.
    expect(pathUpToTime(vertices, times, 0, 3, 9).tip?.[0]).toBeCloseTo(4.5, 6);
    expect(pathUpToTime(vertices, times, 0, 3, Number.POSITIVE_INFINITY)).toEqual({ shownPoints: 3, tip: undefined });
    expect(pathUpToTime(vertices, times, 0, 3, -1)).toEqual({ shownPoints: 0, tip: undefined });
  });

  it("reads in M and, for a known mass, in seconds: GM☉/c³ = 4.925 µs (IAU 2015 B3 nominal GM☉)", () => {
    expect(sliderTimeText(Number.POSITIVE_INFINITY, 10)).toBe("all paths whole");
    expect(sliderTimeText(120, undefined)).toBe("t = 120 M");
    // 120 M × 10 M☉ × 4.925491 µs = 5.911 ms.
    expect(sliderTimeText(120, 10)).toBe("t = 120 M (5.91 ms)");
  });
});
