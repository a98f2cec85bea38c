import { describe, expect, it } from "vitest";
import { timeRequestOf, timeRequestSentence } from "@/lib/workspace/time-request";

describe("a proposal's time request", () => {
  it("sums the targets that have a photon budget and counts the rest", () => {
    expect(timeRequestOf([{ timeRequestHours: 2 }, { timeRequestHours: null }, { timeRequestHours: 0.5 }])).toEqual({ totalHours: 2.5, budgetedTargets: 2, targetCount: 3 });
    expect(timeRequestOf([])).toEqual({ totalHours: 0, budgetedTargets: 0, targetCount: 0 });
  });

  it("says what is missing when no target has a budget, and how many lack one otherwise", () => {
    expect(timeRequestSentence({ totalHours: 0, budgetedTargets: 0, targetCount: 4 })).toMatch(/^no photon budget yet: set the telescope aperture/);
    expect(timeRequestSentence({ totalHours: 12.345, budgetedTargets: 4, targetCount: 4 })).toBe("12.3 h (exposures and overheads over the visits each case needs) for 4 of 4 targets");
    expect(timeRequestSentence({ totalHours: 12.345, budgetedTargets: 3, targetCount: 4 })).toMatch(/for 3 of 4 targets; 1 without a photon budget/);
  });
});
