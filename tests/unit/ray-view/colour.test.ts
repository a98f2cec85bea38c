import { describe, expect, it } from "vitest";
import { densityOpacity, fractionOnScale, quantityScale, rampColour, rayColours, rayQuantity, vertexColours } from "@/lib/ray-view/colour";

describe("colouring the rays by a quantity", () => {
  it("gives deflections in degrees and arrival as the delay over a straight ray's 2R₀, NaN where a ray has none", () => {
    const bundle = { rayDeflectionsRad: new Float32Array([Math.PI / 2, NaN]), rayArrivalTimesM: new Float32Array([65, NaN]), startRadiusM: 30 };
    const degrees = rayQuantity(bundle, "deflection");
    expect(degrees[0]).toBeCloseTo(90, 4);
    expect(Number.isNaN(degrees[1])).toBe(true);
    expect(rayQuantity(bundle, "arrival")[0]).toBe(5);
  });

  it("labels a logarithmic scale at round values, with its unit in the title", () => {
    const scale = quantityScale(new Float32Array([2.3, 40, 180, NaN, 0]), "deflection")!;
    expect(scale.title).toMatch(/degrees/);
    expect([scale.min, scale.max].map((value) => Number(value.toPrecision(3)))).toEqual([2.3, 180]);
    expect(scale.ticks.map((tick) => tick.label)).toEqual(["5", "10", "20", "50", "100"]);
    // log(10/2.3) / log(180/2.3)
    expect(scale.ticks[1].fraction).toBeCloseTo(Math.log(10 / 2.3) / Math.log(180 / 2.3), 6);
    expect(scale.ticks.every((tick, k) => k === 0 || tick.fraction > scale.ticks[k - 1].fraction)).toBe(true);
  });

  it("labels the ends of a scale too narrow to hold two round values, and has none without values", () => {
    const narrow = quantityScale(new Float32Array([2.3, 2.9]), "arrival")!;
    expect(narrow.ticks.map((tick) => [tick.label, tick.fraction])).toEqual([
      ["2.3", 0],
      ["2.9", 1],
    ]);
    expect(quantityScale(new Float32Array([NaN, -1]), "arrival")).toBeUndefined();
  });

  it("places values on the scale, clamped, and nowhere without a value", () => {
    const scale = { min: 1, max: 100 };
    expect(fractionOnScale(10, scale)).toBeCloseTo(0.5, 12);
    expect(fractionOnScale(1000, scale)).toBe(1);
    expect(Number.isNaN(fractionOnScale(NaN, scale))).toBe(true);
  });

  it("runs the ramp dark to light on paper and stays clear of the night ground on screen (cividis)", () => {
    const lightness = ([r, g, b]: number[]) => 0.2126 * r + 0.7152 * g + 0.0722 * b;
    for (const ink of ["screen", "print"] as const) {
      const along = [0, 0.25, 0.5, 0.75, 1].map((fraction) => lightness(rampColour(fraction, ink)));
      expect(along.every((value, k) => k === 0 || value > along[k - 1])).toBe(true);
    }
    // Screen's darkest end is far from the ground #05070c; paper's lightest is far from white.
    expect(lightness(rampColour(0, "screen"))).toBeGreaterThan(60);
    expect(lightness(rampColour(1, "print"))).toBeLessThan(215);
  });

  it("colours by fate, or by the ramp with the rays that have no value in the rest colour", () => {
    const fates = new Uint8Array([0, 1]);
    expect(Array.from(rayColours(fates, undefined, undefined, "screen", ["#56B4E9", "#D55E00"], "#808080"))).toEqual([0x56, 0xb4, 0xe9, 0xd5, 0x5e, 0x00]);
    const values = new Float32Array([10, NaN]);
    const scale = quantityScale(new Float32Array([1, 100]), "deflection")!;
    const coloured = rayColours(fates, values, scale, "screen", ["#56B4E9", "#D55E00"], "#808080");
    expect(Array.from(coloured.slice(0, 3))).toEqual(rampColour(0.5, "screen"));
    expect(Array.from(coloured.slice(3))).toEqual([128, 128, 128]);
  });

  it("spreads each ray's colour over its points", () => {
    const colours = new Uint8Array([1, 2, 3, 4, 5, 6]);
    expect(Array.from(vertexColours(colours, new Uint32Array([0, 2, 3])))).toEqual([1, 2, 3, 1, 2, 3, 4, 5, 6]);
  });

  it("draws each ray of a dense bundle fainter, as 1/√N past 2,000 rays", () => {
    expect(densityOpacity(400)).toBe(1);
    expect(densityOpacity(2000)).toBeCloseTo(Math.sqrt(0.2), 12);
    expect(densityOpacity(8000)).toBeCloseTo(Math.sqrt(0.05), 12);
  });
});
