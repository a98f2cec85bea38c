import { describe, expect, it } from "vitest";
import { fieldEcho } from "@/lib/bench/field-echo";
import { demoSketch, type Sketch } from "@/lib/bench/sketch-state";
import { echoQuantity } from "@/lib/physics";

const sketch = (changes: Partial<Sketch>): Sketch => ({ ...demoSketch, ...changes });

describe("field echo", () => {
  it("shows the mass the bench uses for 4,100,000 Msun: 4.1 × 10⁶ M☉, not 4,100", () => {
    const echo = fieldEcho(sketch({ mass: "4,100,000 Msun" }), "mass");
    expect(echo?.echo).toEqual(echoQuantity("mass", "4,100,000 Msun", { defaultUnit: "Msun" }));
    expect(echo?.echo.ok && echo.echo.text).toMatch(/4\.1 × 10⁶/);
    expect(echo?.assumedUnit).toBeUndefined();
  });

  it("says a bare number was read in the field's unit", () => {
    expect(fieldEcho(sketch({ dl: "4" }), "dl")?.assumedUnit).toBe("kpc");
    expect(fieldEcho(sketch({ mass: "0.5" }), "mass")?.assumedUnit).toBe("M☉");
    expect(fieldEcho(sketch({ u0: "0.2" }), "u0")?.assumedUnit).toBeUndefined();
  });

  it("reads β as an angle or a number, as the form gives it, and the lens radius's default as compact", () => {
    expect(fieldEcho(sketch({ betaUnit: "angle", beta: "45 uas" }), "beta")?.echo).toEqual(echoQuantity("angle", "45 uas", { defaultUnit: "mas" }));
    expect(fieldEcho(sketch({ betaUnit: "thetaE", beta: "0.3" }), "beta")?.echo).toEqual(echoQuantity("number", "0.3"));
    expect(fieldEcho(sketch({ radius: "compact" }), "radius")?.echo).toMatchObject({ ok: true, text: "= compact object (no surface outside its photon sphere)" });
    expect(fieldEcho(sketch({}), "lens")).toBeUndefined();
  });

  it("has no echo, only the parser's reason, for text that does not read", () => {
    expect(fieldEcho(sketch({ mass: "45 uas" }), "mass")?.echo.ok).toBe(false);
  });
});
