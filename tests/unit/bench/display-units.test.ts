import { describe, expect, it } from "vitest";
import { AUTO_UNIT, displayUnit, formatInUnit, readUnitChoices, withUnitChoice } from "@/lib/bench/display-units";
import { demoSketch, sketchFromSearchParams, sketchToQueryString } from "@/lib/bench/sketch-state";
import { AU_M, DAY_S, MICROARCSECOND_RAD, MILLIARCSECOND_RAD } from "@/lib/physics";

/** A value as the results panel shows it when the user has chosen no unit. */
const readable = (kind: "angle" | "time" | "length", value: number) => formatInUnit(kind, value, displayUnit(kind, value, undefined));

describe("readable result units", () => {
  it("shows t_E = 124400 d in years and δθ = 1.746e6 µas in arcseconds (the issue's two probes)", () => {
    // 124,400 d / 365.25 d per Julian year (IAU) = 340.6 yr.
    expect(readable("time", 124_400 * DAY_S)).toBe("340.6 yr");
    // 1.746e6 µas = 1.746″ (1″ = 10⁶ µas).
    expect(readable("angle", 1.746e6 * MICROARCSECOND_RAD)).toBe("1.746 arcsec");
  });

  it("keeps days up to ~1,000 d and steps angles µas → mas → arcsec → deg", () => {
    expect(readable("time", 999 * DAY_S)).toBe("999 d");
    expect(readable("time", 1001 * DAY_S)).toBe("2.741 yr");
    expect(readable("time", 4.9e-6)).toBe("4.9 µs");
    expect(readable("time", 3 * 3600)).toBe("3 h");
    expect(readable("angle", 0.5 * MILLIARCSECOND_RAD)).toBe("500 µas");
    expect(readable("angle", 713.4 * MILLIARCSECOND_RAD)).toBe("713.4 mas");
    expect(readable("angle", 2 * (Math.PI / 180))).toBe("2 deg");
    expect(readable("length", 2953)).toBe("2.953 km");
    expect(readable("length", 0.079 * AU_M)).toBe("0.079 au");
  });

  it("lets the user's unit win, and ignores a unit of another kind", () => {
    const tE = 124_400 * DAY_S;
    expect(formatInUnit("time", tE, displayUnit("time", tE, "d"))).toBe("124400 d");
    expect(formatInUnit("time", tE, displayUnit("time", tE, "s"))).toBe("1.075 × 10¹⁰ s");
    expect(displayUnit("time", tE, "mas")).toBe("yr");
    expect(displayUnit("ratio", 3, "yr")).toBe("");
  });

  it("writes powers of ten as astronomers do, never as 1.746e6, ratios included", () => {
    expect(formatInUnit("ratio", 2.5e7, "")).toBe("2.5 × 10⁷");
    expect(formatInUnit("ratio", -3e-9, "")).toBe("−3 × 10⁻⁹");
    expect(formatInUnit("angle", -1.5e-7 * MICROARCSECOND_RAD, "uas")).toBe("−1.5 × 10⁻⁷ µas");
    expect(formatInUnit("ratio", Number.NaN, "")).toBe("—");
  });
});

describe("unit choices in the link", () => {
  it("adds, replaces and clears a row's unit, in a stable order", () => {
    const one = withUnitChoice("", "t-e", "d");
    expect(one).toBe("t-e:d");
    const two = withUnitChoice(one, "theta-e", "arcsec");
    expect(two).toBe("t-e:d,theta-e:arcsec");
    expect(withUnitChoice(two, "t-e", AUTO_UNIT)).toBe("theta-e:arcsec");
    expect(readUnitChoices(two)).toEqual({ "t-e": "d", "theta-e": "arcsec" });
  });

  it("ignores anything in the link that is not a row id with a known unit", () => {
    expect(readUnitChoices("t-e:furlong,<b>:d,theta-e:mas,:yr,junk")).toEqual({ "theta-e": "mas" });
  });

  it("survives the round trip through the query string", () => {
    const sketch = { ...demoSketch, units: "t-e:d,theta-e:arcsec" };
    expect(sketchFromSearchParams(Object.fromEntries(new URLSearchParams(sketchToQueryString(sketch))))).toEqual(sketch);
    expect(sketchFromSearchParams({}).units).toBe("");
  });
});
