import { describe, expect, it } from "vitest";
import { formatExactForPeople, formatSignificant, machineSignificantText, roundToSignificant } from "@/lib/numbers/significant";
import { parseNumber } from "@/lib/physics/units";

// Expected texts are worked by hand: the digits kept, the next digit deciding the rounding, and for
// the halfway cases the binary value of the typed decimal (IEEE 754 double, read from
// `value.toPrecision(20)`), which is what toExponential rounds.
describe("numbers for people (formatSignificant)", () => {
  it("writes 0.001 up to below a million plainly, trailing zeros dropped", () => {
    expect(formatSignificant(5.075)).toBe("5.075");
    expect(formatSignificant(100)).toBe("100"); // not "100.0"
    expect(formatSignificant(0.001)).toBe("0.001");
    expect(formatSignificant(0.0012346)).toBe("0.001235"); // 1.2346 → 1.235 (next digit 6)
    expect(formatSignificant(123456)).toBe("123500"); // 1.23456 → 1.235, exponent 5
    expect(formatSignificant(42, 1)).toBe("40");
  });

  it("writes smaller and larger values as m × 10ⁿ with a superscript exponent", () => {
    expect(formatSignificant(1.5e-7)).toBe("1.5 × 10⁻⁷");
    expect(formatSignificant(0.00012345, 3)).toBe("1.23 × 10⁻⁴"); // 1.2345 → 1.23 (next digit 4)
    expect(formatSignificant(1234567)).toBe("1.235 × 10⁶"); // 1.234567 → 1.235
    expect(formatSignificant(6.02214076e23)).toBe("6.022 × 10²³");
    expect(formatSignificant(1e21)).toBe("1 × 10²¹");
    expect(formatSignificant(2.5e7)).toBe("2.5 × 10⁷");
  });

  it("decides the form after rounding", () => {
    expect(formatSignificant(999_999.7)).toBe("1 × 10⁶"); // rounds up to 1.000e6
    expect(formatSignificant(0.00099996)).toBe("0.001"); // rounds up to 1.000e-3
    expect(formatSignificant(9.9951, 3)).toBe("10");
  });

  it("rounds the stored double: 9.995 is 9.99499999999999921… so three digits give 9.99", () => {
    expect((9.995).toPrecision(20)).toBe("9.9949999999999992184");
    expect(formatSignificant(9.995, 3)).toBe("9.99");
    expect(formatSignificant(9.995, 4)).toBe("9.995");
    // 99.95 is 99.950000000000002842…, above the half: 100 at three digits.
    expect(formatSignificant(99.95, 3)).toBe("100");
    // 0.125 is exact in binary: a true tie, which goes to the larger magnitude (ECMA-262 toExponential).
    expect(formatSignificant(0.125, 2)).toBe("0.13");
    expect(formatSignificant(-0.125, 2)).toBe("−0.13");
  });

  it("writes negatives with a true minus sign and zero without one", () => {
    expect(formatSignificant(-273.16)).toBe("−273.2"); // 273.16000000000002501 → 273.2
    expect(formatSignificant(-4.1e-7, 2)).toBe("−4.1 × 10⁻⁷");
    expect(formatSignificant(-3e-9)).toBe("−3 × 10⁻⁹");
    expect(formatSignificant(0)).toBe("0");
    expect(formatSignificant(-0)).toBe("0");
  });

  it("writes no value as a dash and infinities as ∞", () => {
    expect(formatSignificant(Number.NaN)).toBe("—");
    expect(formatSignificant(null)).toBe("—");
    expect(formatSignificant(undefined)).toBe("—");
    expect(formatSignificant(Number.POSITIVE_INFINITY)).toBe("∞");
    expect(formatSignificant(Number.NEGATIVE_INFINITY)).toBe("−∞");
  });

  it("is read back by the quantity parser as the rounded value", () => {
    for (const value of [-4.1e-7, 1.5e-7, 6.02214076e23, -273.16, 0.0012346, 123456, 1e21]) {
      const text = formatSignificant(value, 4);
      expect(parseNumber(text)).toBe(roundToSignificant(value, 4));
    }
  });
});

describe("exact numbers for people (bounds a person may type back)", () => {
  it("keeps every digit of the shortest round-trip text, in the same power-of-ten style", () => {
    expect(formatExactForPeople(1e-6)).toBe("1 × 10⁻⁶");
    expect(formatExactForPeople(1.25e16)).toBe("1.25 × 10¹⁶");
    expect(formatExactForPeople(0.1 + 0.2)).toBe("0.30000000000000004");
    expect(formatExactForPeople(-2.5e-9)).toBe("−2.5 × 10⁻⁹");
    expect(formatExactForPeople(0)).toBe("0");
    for (const value of [1e-6, 1.25e16, 0.1 + 0.2, -2.5e-9, 123456.789]) expect(parseNumber(formatExactForPeople(value))).toBe(value);
  });
});

describe("numbers for data files (machine forms)", () => {
  it("rounds to significant digits as a double", () => {
    expect(roundToSignificant(123_456_789, 4)).toBe(123_500_000);
    expect(roundToSignificant(9.995, 3)).toBe(9.99);
    expect(roundToSignificant(-0.000123456, 2)).toBe(-0.00012);
  });

  it("writes the shortest text that reads back as the rounded double, ASCII minus and e-notation", () => {
    expect(machineSignificantText(1.23456e-7, 3)).toBe("1.23e-7");
    expect(machineSignificantText(-42, 17)).toBe("-42");
    expect(machineSignificantText(0.1 + 0.2, 17)).toBe("0.30000000000000004");
    expect(machineSignificantText(2.5e21, 4)).toBe("2.5e+21");
    expect(Number(machineSignificantText(0.1 + 0.2, 17))).toBe(0.1 + 0.2);
  });
});
