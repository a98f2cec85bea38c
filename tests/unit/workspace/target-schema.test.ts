import { describe, expect, it } from "vitest";
import { createTargetSchema, lensHypothesisErrors, updateTargetSchema } from "@/lib/workspace/target-schema";

const point = { lensModel: "point" as const, lensMassSolar: 0.5, lensDistancePc: 4000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.3 };

describe("target input", () => {
  it("turns typed coordinates into degrees and starts with no tags", () => {
    const parsed = createTargetSchema.parse({ name: " T1 ", ra: "12 00 00", dec: "-45 30 00", ...point, priority: 1 });
    expect(parsed).toMatchObject({ name: "T1", ra: 180, dec: -45.5, tags: [] });
    expect("status" in parsed).toBe(false);
  });

  it("names every bad field at once", () => {
    const result = createTargetSchema.safeParse({ name: "", ra: "25 00 00", dec: "x", ...point, priority: 9, tags: ["has space"] });
    expect(result.success).toBe(false);
    const fields = new Set(result.error!.issues.map((i) => String(i.path[0])));
    expect(fields).toEqual(new Set(["name", "ra", "dec", "priority", "tags"]));
  });

  it("a status-only update leaves the tags alone (regression: a default in the base schema cleared them)", () => {
    expect(updateTargetSchema.parse({ status: "accepted" })).toEqual({ status: "accepted" });
  });
});

describe("lens hypothesis across fields", () => {
  it("accepts a complete point-lens or isothermal hypothesis", () => {
    expect(lensHypothesisErrors(point)).toEqual({});
    expect(lensHypothesisErrors({ lensModel: "sis", velocityDispersionKmPerS: 250, lensRedshift: 0.4, sourceRedshift: 1.8, sourceOffsetThetaE: 0.3 })).toEqual({});
  });

  it("asks for the parameter each model needs", () => {
    expect(Object.keys(lensHypothesisErrors({ ...point, lensMassSolar: null }))).toEqual(["lensMassSolar"]);
    expect(Object.keys(lensHypothesisErrors({ ...point, lensModel: "sis" }))).toEqual(["velocityDispersionKmPerS"]);
  });

  it("wants the source behind the lens, and one kind of geometry", () => {
    expect(Object.keys(lensHypothesisErrors({ ...point, sourceDistancePc: 3000 }))).toEqual(["sourceDistancePc"]);
    expect(Object.keys(lensHypothesisErrors({ ...point, lensRedshift: 0.1, sourceRedshift: 0.5 }))).toEqual(["lensRedshift"]);
    expect(Object.keys(lensHypothesisErrors({ ...point, lensDistancePc: null, sourceDistancePc: null, lensRedshift: 0.5, sourceRedshift: 0.5 }))).toEqual(["sourceRedshift"]);
    expect(Object.keys(lensHypothesisErrors({ ...point, lensDistancePc: null }))).toEqual(["lensDistancePc"]);
  });
});
