import { describe, expect, it } from "vitest";
import { fieldEcho } from "@/lib/bench/field-echo";
import { demoSketch, type Sketch } from "@/lib/bench/sketch-state";
import { echoQuantity } from "@/lib/physics";

const sketch = (changes: Partial<Sketch>): Sketch => ({ ...demoSketch, ...changes });

describe("field echo", () => {
  it("shows the mass the bench uses for 4,100,000 Msun: 4.1 × 10⁶ M☉, not 4,100", () => {
    const echo = fieldEcho(sketch({ mass: "4,100,000 Msun" }), "mass");
    expect(echo).toEqual(echoQuantity("mass", "4,100,000 Msun", { defaultUnit: "Msun" }));
    expect(echo?.ok && echo.text).toMatch(/4\.1 × 10⁶/);
    expect(echo?.ok && echo.assumedUnit).toBe(false);
  });

  it("takes a bare number in the field's unit, and says so", () => {
    expect(fieldEcho(sketch({ dl: "4" }), "dl")).toEqual(echoQuantity("distance", "4", { defaultUnit: "kpc" }));
    expect(fieldEcho(sketch({ dl: "4" }), "dl")).toMatchObject({ ok: true, assumedUnit: true });
    expect(fieldEcho(sketch({ mass: "0.5" }), "mass")).toMatchObject({ ok: true, assumedUnit: true });
    expect(fieldEcho(sketch({ u0: "0.2" }), "u0")).toEqual(echoQuantity("number", "0.2"));
  });

  it("reads β as an angle or a number, as the form gives it, and the lens radius's default as compact", () => {
    expect(fieldEcho(sketch({ betaUnit: "angle", beta: "45 uas" }), "beta")).toEqual(echoQuantity("angle", "45 uas", { defaultUnit: "mas" }));
    expect(fieldEcho(sketch({ betaUnit: "thetaE", beta: "0.3" }), "beta")).toEqual(echoQuantity("number", "0.3"));
    expect(fieldEcho(sketch({ radius: "compact" }), "radius")).toMatchObject({ ok: true, text: "= compact object (no surface outside its photon sphere)" });
    expect(fieldEcho(sketch({}), "lens")).toBeUndefined();
  });

  it("has no echo, only the parser's reason, for text that does not read", () => {
    expect(fieldEcho(sketch({ mass: "45 uas" }), "mass")?.ok).toBe(false);
  });
});
