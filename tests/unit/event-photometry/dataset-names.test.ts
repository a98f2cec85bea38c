import { describe, expect, it } from "vitest";
import { uniqueDatasetNames } from "@/lib/event-photometry/dataset-names";

describe("dataset names across a target's files (our rule)", () => {
  it("keeps a free name and suffixes a taken one with the first free number", () => {
    expect(uniqueDatasetNames(["Halcyon I", "Mesa Lucerna V"], [])).toEqual(["Halcyon I", "Mesa Lucerna V"]);
    expect(uniqueDatasetNames(["Halcyon I", "Mesa Lucerna V"], ["Halcyon I"])).toEqual(["Halcyon I (2)", "Mesa Lucerna V"]);
    expect(uniqueDatasetNames(["Halcyon I"], ["Halcyon I", "Halcyon I (2)", "Halcyon I (4)"])).toEqual(["Halcyon I (3)"]);
  });

  it("never gives two datasets of one file the same name", () => {
    // "A (2)" is a dataset of the file itself: "A", taken, must not become it too.
    expect(uniqueDatasetNames(["A (2)", "A"], ["A"])).toEqual(["A (2)", "A (3)"]);
  });
});
