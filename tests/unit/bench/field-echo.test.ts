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
    expect(fieldEcho(sketch({ rays: "200" }), "rays")).toEqual(echoQuantity("number", "200"));
  });

  it("echoes a target's and a proposal's fields as their forms do, and the event peak as a date", () => {
    expect(fieldEcho(sketch({ visit: "0.5 h" }), "visit")).toEqual({ ok: true, text: "= 30 min", assumedUnit: false });
    expect(fieldEcho(sketch({ moonSep: "" }), "moonSep")).toBeUndefined();
    expect(fieldEcho(sketch({ t0: "JD 2461596.5" }), "t0")).toEqual({ ok: true, text: "= 2027-07-10 00:00 UTC (JD 2461596.50)", assumedUnit: false });
    expect(fieldEcho(sketch({ t0: "45 d" }), "t0")).toMatchObject({ ok: false });
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
