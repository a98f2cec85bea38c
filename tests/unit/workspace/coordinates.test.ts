import { describe, expect, it } from "vitest";
import { slowdown } from "../../support/timing";
import { CoordinateError, degreesFieldText, formatDeclination, formatRightAscension, parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";

describe("right ascension", () => {
  it.each([
    ["17 45 40.04", 266.41683333],
    ["17:45:40.04", 266.41683333],
    ["17h45m40.04s", 266.41683333],
    ["0 0 0", 0],
    ["266.4168", 266.4168],
    ["266.4168d", 266.4168],
    [359.999, 359.999],
  ])("%s → %f degrees", (input, degrees) => {
    expect(parseRightAscensionDeg(input)).toBeCloseTo(degrees, 7);
  });

  it.each([
    ["24 00 00", /hours must be below 24/],
    ["12 60 00", /minutes must be below 60/],
    ["12 00 60", /seconds must be below 60/],
    ["-01 00 00", /cannot be negative/],
    ["360", /\[0, 360\)/],
    ["north", /hours "hh mm ss.s" or degrees/],
    ["", /hours "hh mm ss.s" or degrees/],
  ])("refuses %j", (input, message) => {
    expect(() => parseRightAscensionDeg(input)).toThrow(CoordinateError);
    expect(() => parseRightAscensionDeg(input)).toThrow(message);
  });
});

describe("declination", () => {
  it.each([
    ["-29 00 28.1", -29.00780556],
    ["-00 30 00", -0.5],
    ["+41d16m09s", 41.26916667],
    ["-29.0078", -29.0078],
    [90, 90],
  ])("%s → %f degrees", (input, degrees) => {
    expect(parseDeclinationDeg(input)).toBeCloseTo(degrees, 7);
  });

  it("keeps the sign of a declination between 0 and -1 degree", () => {
    expect(parseDeclinationDeg("-00 00 01")).toBeLessThan(0);
  });

  it.each(["-90 00 01", "91", "12 75 00"])("refuses %j", (input) => {
    expect(() => parseDeclinationDeg(input)).toThrow(CoordinateError);
  });
});

describe("display", () => {
  it("round-trips through the sexagesimal text", () => {
    expect(formatRightAscension(266.41683333)).toBe("17h45m40.04s");
    expect(formatDeclination(-29.00780556)).toBe("−29°00′28.1″");
    expect(parseRightAscensionDeg(formatRightAscension(123.456789).replace(/[hm]/g, " ").replace("s", ""))).toBeCloseTo(123.456789, 4);
  });

  it("reads back the declination it displays, true minus sign included (issue 15: a value copied from a paper or from our own page)", () => {
    // −29°00′28.1″ = −(29 + 0/60 + 28.1/3600)° by definition of the sexagesimal notation.
    expect(parseDeclinationDeg(formatDeclination(-29.00780556))).toBeCloseTo(-(29 + 28.1 / 3600), 10);
    expect(parseDeclinationDeg("\u221229.0078")).toBe(-29.0078);
  });

  it("never prints 60 seconds (regression: rounding carried into the next minute)", () => {
    expect(formatRightAscension(((59 * 60 + 59.999) / 3600) * 15)).toBe("01h00m00.00s");
    expect(formatDeclination(-(10 + 59 / 60 + 59.97 / 3600))).toBe("−11°00′00.0″");
  });
});

describe("hostile text (regression: a 3 KB coordinate held a server process for seconds)", () => {
  const refused = (parse: () => unknown) => () => expect(parse).toThrow(CoordinateError);

  it("answers long runs of spaces between the fields in linear time", async () => {
    const hostile = `1${" ".repeat(500)}1${" ".repeat(500)}x`;
    const ratio = await slowdown(refused(() => parseDeclinationDeg(hostile)), () => parseDeclinationDeg("-29 00 28.1"), { hostileCalls: 5, normalCalls: 100 });
    // Linear work on 1,003 characters against 11 stays well under this bound; the old pattern was 10^5 times slower.
    expect(ratio).toBeLessThan(1000);
  });

  it("still reads any spacing around the separators", () => {
    expect(parseRightAscensionDeg("17   45   40.04")).toBeCloseTo(266.41683333, 7);
    expect(parseRightAscensionDeg("17 h 45 m 40.04 s")).toBeCloseTo(266.41683333, 7);
    expect(parseDeclinationDeg("- 29 : 00 : 28.1")).toBeCloseTo(-29.00780556, 7);
  });
});

describe("degrees as a form field holds them (the target form and the bench link)", () => {
  it("reads back as the same double, with no exponent form the reader refuses", () => {
    expect(degreesFieldText(266.41683333333333)).toBe("266.41683333333333");
    // 1e-7 is "1e-7" in JavaScript's shortest form; fifteen decimals write it plainly.
    expect(degreesFieldText(1e-7)).toBe("0.000000100000000");
    expect(degreesFieldText(-5e-8)).toBe("-0.000000050000000");
    for (const value of [-29.00780555555556, 1e-7, -5e-8, 0]) expect(parseDeclinationDeg(degreesFieldText(value))).toBe(value);
    expect(parseRightAscensionDeg(degreesFieldText(266.41683333333333))).toBe(266.41683333333333);
  });
});
