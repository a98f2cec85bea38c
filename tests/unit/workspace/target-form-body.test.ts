import { describe, expect, it } from "vitest";
import { targetBodyOf } from "@/components/targets/target-edit-fields";
import { targetFieldTexts } from "@/components/targets/target-edit-form";
import type { TargetView } from "@/lib/workspace/target-view";
import { createTargetSchema } from "@/lib/workspace/target-schema";
import { exportRows } from "../exports/fixtures";

const typed = { name: "OB-31-0042", ra: "17 57 12.4", dec: "-29 12 05", lensMassSolar: "0.3 Msun", lensDistancePc: "4 kpc", sourceDistancePc: "8 kpc", sourceOffsetThetaE: "0.1", priority: "2", tags: "" };

describe("the target form's request body: the science case and the event's inputs", () => {
  it("sends null for every blank optional field, the inferred case included (an empty choice)", () => {
    const body = targetBodyOf({ ...typed, scienceCase: "", eventPeakJdUtc: " ", sourceRadiusSolar: "", sourceRadiusThetaE: "", limbDarkeningU: "" }, "point", "distance");
    expect(body).toMatchObject({ scienceCase: null, eventPeakJdUtc: null, sourceRadiusSolar: null, sourceRadiusThetaE: null, limbDarkeningU: null });
    expect(createTargetSchema.parse(body)).toMatchObject({ scienceCase: null, eventPeakJdUtc: null, limbDarkeningU: null });
  });

  it("sends the typed text, which the server reads: a chosen case, t0 as a UTC date, the radius with its unit", () => {
    const body = targetBodyOf({ ...typed, scienceCase: "astrometric-microlensing", eventPeakJdUtc: "2027-06-15 04:30", sourceRadiusSolar: "1.2 Rsun", limbDarkeningU: "0.6" }, "point", "distance");
    const parsed = createTargetSchema.parse(body);
    expect(parsed.scienceCase).toBe("astrometric-microlensing");
    // 2027-06-15 04:30 UTC: JD 2461571.5 at 0 h (the example of lib/workspace/event-peak.ts, checked there against astropy.time) plus 4.5 h = 0.1875 d.
    expect(parsed.eventPeakJdUtc).toBeCloseTo(2461571.6875, 9);
    expect(parsed.sourceRadiusSolar).toBe(1.2);
    expect(parsed.limbDarkeningU).toBe(0.6);
  });

  it("an untouched edit form sends back the stored values exactly (t0 as its Julian date to the last digit)", () => {
    const stored: TargetView = exportRows[0];
    const parsed = createTargetSchema.parse(targetBodyOf(targetFieldTexts(stored), stored.lensModel, "distance"));
    expect(parsed).toMatchObject({
      scienceCase: stored.scienceCase,
      eventPeakJdUtc: stored.eventPeakJdUtc,
      sourceRadiusSolar: stored.sourceRadiusSolar,
      sourceRadiusThetaE: stored.sourceRadiusThetaE,
      limbDarkeningU: stored.limbDarkeningU,
    });
  });
});
