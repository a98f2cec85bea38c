import { describe, expect, it } from "vitest";
import { signalToNoiseAxis, signalToNoiseMarks } from "@/lib/figures/signal-to-noise-track";

describe("the S/N track's marks (our rule: the lowest and highest S/N per pixel column)", () => {
  const start = 2_460_000;
  const visitDays = 0.01;
  // Three visits in the first column (one day wide), two in the second, one in the third.
  const visits = [start + 0.1, start + 0.3, start + 0.5, start + 1.2, start + 1.4, start + 2.5];
  const snr = [40, 12, 70, 55, 55, 49];

  it("keeps each column's lowest and highest visit in time order, one mark when they coincide, and flags the visits under the goal", () => {
    const marks = signalToNoiseMarks(visits, visitDays, snr, 50, 1, start);
    expect(marks.map((mark) => mark.visit)).toEqual([1, 2, 3, 5]);
    expect(marks.map((mark) => mark.isBelowGoal)).toEqual([true, false, false, true]);
    expect(marks[0].jdUtc).toBeCloseTo(start + 0.3 + visitDays / 2, 12);
  });

  it("always keeps the worst visit, however many visits share its column", () => {
    const many = Array.from({ length: 10_000 }, (_, i) => start + i * 0.001);
    const values = many.map((_, i) => 100 + Math.sin(i));
    values[7_777] = 3;
    const marks = signalToNoiseMarks(many, visitDays, values, 50, 0.5, start);
    expect(marks.length).toBeLessThanOrEqual(2 * Math.ceil(10 / 0.5) + 2);
    expect(marks.some((mark) => mark.visit === 7_777 && mark.isBelowGoal)).toBe(true);
  });
});

describe("the S/N axis", () => {
  it("is linear from 0 over a narrow range, the goal included", () => {
    expect(signalToNoiseAxis([30, 45, 60], 50)).toEqual({ low: 0, high: 66, isLog: false });
  });

  it("is logarithmic when the S/N spans more than a factor of ten, the goal inside it; zero and non-finite values left out", () => {
    const axis = signalToNoiseAxis([800, 0, Number.NaN, 1200], 50);
    expect(axis.isLog).toBe(true);
    expect(axis.low).toBeLessThan(50);
    expect(axis.high).toBeGreaterThan(1200);
  });
});
