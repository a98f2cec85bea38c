import { describe, expect, it } from "vitest";
import * as constants from "@/lib/physics/constants";
import { acceptedRanges, boundText } from "@/lib/physics/accepted-ranges";
import {
  QuantityError,
  echoQuantity,
  formatAngle,
  formatDistance,
  formatMass,
  formatProperMotion,
  formatTime,
  formatVelocity,
  parseAngle,
  parseNumber,
  parseDistance,
  parseMass,
  parseProperMotion,
  parseTime,
  parseVelocity,
} from "@/lib/physics/units";
import { slowdown } from "../../support/timing";
import { loadFixture, relativeError } from "./fixtures";

const { values, versions } = loadFixture<{ values: Record<string, number> }>("units.json");
const ULP4 = 4 * Number.EPSILON;

describe("constants", () => {
  it("match astropy's IAU constants", () => {
    // fixture from tests/fixtures/generate_physics.py, astropy constants (IAU 2015 B3, IAU 2012 B2)
    expect(constants.GM_SUN_M3_PER_S2).toBe(values.GM_sun_m3_s2);
    expect(constants.SPEED_OF_LIGHT_M_PER_S).toBe(values.c_m_s);
    expect(constants.AU_M).toBe(values.au_m);
    expect(constants.SOLAR_RADIUS_M).toBe(values.R_sun_m);
    expect(relativeError(constants.PARSEC_M, values.pc_m)).toBeLessThan(ULP4);
    expect(relativeError(constants.SOLAR_MASS_TIME_S, values.geometrizedTimeSolar_s)).toBeLessThan(ULP4);
    expect(relativeError(constants.SOLAR_MASS_LENGTH_M, values.geometrizedLengthSolar_m)).toBeLessThan(ULP4);
    console.info(`constants checked against astropy ${versions.astropy}`);
  });

  it("give GM_sun/c^3 = 4.93 us, so one second of mass is about 203,000 solar masses", () => {
    // published check value (issue 3; e.g. any GR text: GM_sun/c^3 = 4.925 us)
    expect(constants.SOLAR_MASS_TIME_S).toBeCloseTo(4.925e-6, 9);
    expect(1 / constants.SOLAR_MASS_TIME_S).toBeCloseTo(203_000, -3);
  });

  it("give 2GM/(c^2 R) of about 4 parts per million at the solar surface", () => {
    // published check value: 2 GM_sun/(c^2 R_sun) = 4.245e-6 (IAU 2015 B3 nominal values)
    expect((2 * constants.SOLAR_MASS_LENGTH_M) / constants.SOLAR_RADIUS_M).toBeCloseTo(4.245e-6, 9);
  });
});

describe("parsers", () => {
  it("read distances as astropy converts them", () => {
    // fixture from tests/fixtures/generate_physics.py, astropy units
    expect(relativeError(parseDistance("8.1 kpc"), values.kpc_pc)).toBeLessThan(ULP4);
    expect(relativeError(parseDistance("8.1kpc"), values.kpc_pc)).toBeLessThan(ULP4);
    expect(relativeError(parseDistance("1.3 Gpc"), values.Gpc_pc)).toBeLessThan(ULP4);
    expect(relativeError(parseDistance("2.1 ly"), values.ly_pc)).toBeLessThan(ULP4);
    expect(relativeError(parseDistance("1 au"), values.au_pc)).toBeLessThan(ULP4);
    expect(parseDistance("12", { defaultUnit: "pc" })).toBe(12);
    // common practice: decimal comma and thousands commas as typed in many locales (issue 15's rules)
    expect(parseDistance("8,1 kpc")).toBe(parseDistance("8.1 kpc"));
    expect(parseDistance("1,000,000 pc")).toBe(1e6);
  });


  it("read angles, including the micro sign and typographic seconds", () => {
    // fixture from tests/fixtures/generate_physics.py, astropy units
    expect(relativeError(parseAngle("45 uas"), values.uas_rad)).toBeLessThan(ULP4);
    expect(relativeError(parseAngle("45 µas"), values.uas_rad)).toBeLessThan(ULP4);
    expect(relativeError(parseAngle("45 μas"), values.uas_rad)).toBeLessThan(ULP4);
    expect(relativeError(parseAngle("350 mas"), values.mas_rad)).toBeLessThan(ULP4);
    expect(relativeError(parseAngle("1.2 arcsec"), values.arcsec_rad)).toBeLessThan(ULP4);
    expect(relativeError(parseAngle("1.2″"), values.arcsec_rad)).toBeLessThan(ULP4);
    expect(relativeError(parseAngle("0.3 deg"), values.deg_rad)).toBeLessThan(ULP4);
    expect(relativeError(parseAngle("0.3°"), values.deg_rad)).toBeLessThan(ULP4);
  });

  it("read velocities, proper motions and times", () => {
    // fixture from tests/fixtures/generate_physics.py, astropy units (yr = Julian year)
    expect(parseVelocity("250 km/s")).toBe(values.kmPerS_mPerS / 1000);
    expect(relativeError(parseProperMotion("5 mas/yr"), values.masPerYr_radPerS)).toBeLessThan(ULP4);
    expect(relativeError(parseProperMotion("5 mas yr^-1"), values.masPerYr_radPerS)).toBeLessThan(ULP4);
    expect(parseTime("1 d")).toBe(values.day_s);
    expect(parseTime("1 yr")).toBe(values.yr_s);
    expect(parseTime("3 h")).toBe(10_800);
  });

  it("read masses, geometrized lengths and times", () => {
    // GM_sun/c^2 = 1476.6 m and GM_sun/c^3 = 4.925 us (IAU 2015 B3 nominal GM_sun)
    expect(parseMass("4e6 Msun")).toEqual({ massSolar: 4e6, interpretedAs: "mass" });
    expect(parseMass("4×10^6 M☉").massSolar).toBe(4e6);
    expect(parseMass("10 M_sun").massSolar).toBe(10);
    expect(parseMass("1.48 km")).toMatchObject({ interpretedAs: "geometrized length" });
    expect(parseMass("1.48 km").massSolar).toBeCloseTo(1.0023, 4);
    expect(parseMass("4.9 us").massSolar).toBeCloseTo(0.994825, 6);
    expect(parseMass("4.9 µs").interpretedAs).toBe("geometrized time");
    // 1.98841e30 kg = GM_sun / G (CODATA 2018 G)
    expect(parseMass("1.98841e30 kg").massSolar).toBeCloseTo(1, 5);
  });

  it("name the quantity in their errors", () => {
    // common practice: the message names the field's quantity and what was typed
    expect(() => parseDistance("8 kg")).toThrow("distance: '8 kg' is a mass, not a distance");
    expect(() => parseAngle("3 km/s")).toThrow("angle: '3 km/s' is a velocity, not an angle");
    expect(() => parseMass("-2 Msun")).toThrow("mass: '-2 Msun' must be greater than zero");
    expect(() => parseMass("NaN")).toThrow(QuantityError);
    expect(() => parseDistance("1e400 pc")).toThrow("is not finite");
    expect(() => parseDistance("12")).toThrow("has no distance unit");
    expect(() => parseTime("")).toThrow("time: '' is empty");
    expect(() => parseProperMotion("5 mas")).toThrow("is an angle, not a proper motion");
    try {
      parseVelocity("fast");
    } catch (error) {
      expect(error).toBeInstanceOf(QuantityError);
      expect((error as QuantityError).quantity).toBe("velocity");
    }
  });
});

describe("number rules (regression: 4,100,000 Msun was read as 4100 and 8,125 kpc silently as 8.125)", () => {
  // The examples (issue 15); the expected values are the numbers as written, by hand.
  it("reads thousands commas only when every group has three digits", () => {
    expect(parseMass("4,100,000 Msun").massSolar).toBe(4.1e6);
    expect(parseMass("1,234,567 Msun").massSolar).toBe(1_234_567);
    expect(parseNumber("4,100,000")).toBe(4.1e6);
    expect(parseNumber("1,234.5")).toBe(1234.5);
    expect(() => parseNumber("1,23,456")).toThrow("not thousands groups of three digits");
  });

  it("refuses a lone comma before three digits, offering both readings", () => {
    expect(() => parseDistance("8,125 kpc")).toThrow("could be 8125 or 8.125");
    expect(() => parseDistance("8,125 kpc")).toThrow("type 8125 or 8.125");
    expect(() => parseAngle("0,125 arcsec")).toThrow("could be 125 or 0.125");
    expect(() => parseNumber("8,125")).toThrow("could be 8125 or 8.125");
    try {
      parseDistance("8,125 kpc");
    } catch (error) {
      expect(error).toBeInstanceOf(QuantityError);
      expect((error as QuantityError).problem).not.toMatch(/[{}()[\]]|\bundefined\b/);
    }
  });

  it("reads any other lone comma as a decimal comma", () => {
    expect(parseNumber("8,1")).toBe(8.1);
    expect(parseNumber("8,12")).toBe(8.12);
    expect(parseNumber("12345,678")).toBe(12345.678);
    expect(parseDistance("8,1 kpc")).toBe(8100);
  });

  it("refuses a point before a comma (the European form) and more than one point", () => {
    expect(() => parseNumber("1.234,5")).toThrow("type 1234.5 if that is the number");
    expect(() => parseNumber("1.234.567")).toThrow("more than one point");
  });

  it("reads digits grouped by spaces as the SI Brochure (5.4.4) and the IAU style manual write them", () => {
    expect(parseMass("4 100 000 Msun").massSolar).toBe(4.1e6);
    expect(parseMass("4\u2009100\u2009000 Msun").massSolar).toBe(4.1e6);
    expect(parseNumber("4\u202f100\u202f000,5")).toBe(4100000.5);
    expect(parseNumber("12 345.678")).toBe(12345.678);
    expect(() => parseNumber("4 100,125")).toThrow("could be 4100125 or 4100.125");
    expect(() => parseDistance("4 1000 pc")).toThrow("a space inside its number");
  });

  it("reads powers of ten in every common spelling", () => {
    for (const text of ["4e6", "4E6", "4E+06", "4×10^6", "4 × 10^6", "4x10^6", "4 x 10**6", "4*10^6", "4·10^6", "4 × 10⁶", "4×10⁺⁶", "4,000,000"]) {
      expect(parseNumber(text), text).toBe(4e6);
    }
    expect(parseNumber("2.5×10⁻³")).toBe(2.5e-3);
    expect(parseNumber("−3")).toBe(-3);
    expect(() => parseNumber("4×10")).toThrow("power of ten without its exponent");
  });
});

describe("long input (regression: the unit clean-up took quadratic time on a run of spaces)", () => {
  const refused = (parse: () => unknown) => () => expect(parse).toThrow(QuantityError);

  it("refuses a unit text longer than 100 characters as fast as it reads a normal one", async () => {
    const hostile = `1${" ".repeat(20_000)}x`;
    expect(() => parseDistance(hostile)).toThrow("is longer than 100 characters");
    expect(await slowdown(refused(() => parseDistance(hostile)), () => parseDistance("8.1 kpc"), { hostileCalls: 5, normalCalls: 20 })).toBeLessThan(20);
  });

  it("reads spaced typographic units up to the length limit", () => {
    expect(parseAngle(`1.2${" ".repeat(40)}″`)).toBe(parseAngle("1.2″"));
    expect(parseMass(`4 ${" ".repeat(30)}× 10^6 M ☉`).massSolar).toBe(4e6);
  });
});

describe("formatters", () => {
  it("show values in the chosen unit", () => {
    // round trips of the parsers above (common practice)
    expect(formatDistance(8100, "kpc")).toBe("8.1 kpc");
    expect(formatAngle(parseAngle("45 uas"), "uas")).toBe("45 uas");
    expect(formatAngle(parseAngle("1.2 arcsec"), "mas")).toBe("1200 mas");
    expect(formatMass(4e6)).toBe("4 × 10⁶ Msun");
    expect(formatMass(1, "km")).toBe("1.477 km");
    expect(formatMass(1, "us")).toBe("4.925 us");
    expect(formatVelocity(250, "m/s")).toBe("250000 m/s");
    expect(formatVelocity(2500, "m/s")).toBe("2.5 × 10⁶ m/s");
    expect(formatVelocity(-2500, "m/s")).toBe("−2.5 × 10⁶ m/s");
    expect(formatProperMotion(parseProperMotion("5 mas/yr"))).toBe("5 mas/yr");
    expect(formatTime(86_400 * 3)).toBe("3 d");
    expect(() => formatDistance(1, "kg")).toThrow("distance: 'kg' is not a distance unit");
    expect(() => formatMass(1, "deg")).toThrow("mass: 'deg' is not a mass unit");
  });
});

describe("range bounds in messages (issue 15: a refusal says what to type instead)", () => {
  it("are written so that typing them back reads the same number: no comma groups the parser refuses as ambiguous", () => {
    // SI Brochure, 9th ed., §5.4.4: digits in groups of three separated by a thin space, none for four digits.
    expect(boundText(3000)).toBe("3000");
    expect(boundText(12345)).toBe("12\u202f345");
    expect(boundText(2e10)).toBe("20\u202f000\u202f000\u202f000");
    for (const range of Object.values(acceptedRanges)) {
      for (const bound of [range.min, range.max]) expect(parseNumber(boundText(bound))).toBe(bound);
    }
  });
});

describe("angles typed in degrees, arcminutes and arcseconds together (issue 15: ° ′ ″ as astronomers type them)", () => {
  // 1° = 60′ = 3600″ by definition (SI Brochure, 9th ed., Table 8); a sign applies to the whole angle.
  const degreesOf = (text: string) => (parseAngle(text) * 180) / Math.PI;

  it("reads the sexagesimal forms with Unicode primes, ASCII primes and a true minus sign", () => {
    expect(degreesOf("12°30′")).toBeCloseTo(12.5, 13);
    expect(degreesOf("-24° 37′ 38.5″")).toBeCloseTo(-(24 + 37 / 60 + 38.5 / 3600), 13);
    expect(degreesOf("\u22120° 30′")).toBeCloseTo(-0.5, 13);
    expect(degreesOf("1′30″")).toBeCloseTo(90 / 3600, 15);
    expect(degreesOf("0°0'1.2''")).toBeCloseTo(1.2 / 3600, 15);
    expect(echoQuantity("angle", "12°30′")).toEqual({ ok: true, text: "= 12.5°", assumedUnit: false });
  });

  it("refuses a malformed one in words, saying what to type, instead of reading '12°30′' as a power of 30", () => {
    const problem = (text: string) => {
      const echo = echoQuantity("angle", text);
      return echo.ok ? echo.text : echo.message;
    };
    expect(problem("12° 30")).toBe("has '30' with no ′ or ″ after it; type e.g. 12°30′ or -24° 37′ 38.5″");
    expect(problem("12°75′")).toMatch(/^has arcminutes or arcseconds of 60 or more; type /);
    expect(problem("12.5°30′")).toMatch(/^has a fraction before its last part; type /);
    expect(problem("30′12°")).toMatch(/^has its degrees, arcminutes and arcseconds out of order; type /);
    expect(problem("12° -30′")).toMatch(/^has '-30' where a number of arcminutes goes; type /);
  });
});
