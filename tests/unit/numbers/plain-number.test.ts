import { describe, expect, it } from "vitest";
import { PLAIN_NUMBER, readPlainNumber } from "@/lib/numbers/plain-number";
import { FORMULA_CELL, isFormulaLike } from "@/lib/imports/formula";

// The accepted spellings are ECMAScript's StrDecimalLiteral (ECMA-262 §7.1.4.1.1) without
// "Infinity": what Number() reads, so a matching text converts to the number it shows.
describe("the plain decimal number", () => {
  it("takes a sign, digits with or without a point, and an e-exponent", () => {
    for (const [text, value] of [["8000.5", 8000.5], ["-1.2e3", -1200], ["+.5", 0.5], ["5.", 5], ["1E-7", 1e-7], ["0", 0], ["-0.0", -0]] as const) {
      expect(readPlainNumber(text)).toBe(value);
    }
  });

  it("refuses separators, words, hex, spaces and a lone point or sign", () => {
    for (const text of ["1,000", "1 000", "NaN", "Infinity", "-Infinity", "0x10", " 5", "5 ", ".", "-", "e5", "1e", "1e+", "1.2.3", "4×10^6", "1e5.5", ""]) {
      expect(readPlainNumber(text)).toBeUndefined();
      expect(PLAIN_NUMBER.test(text)).toBe(false);
    }
  });

  it("is the number a spreadsheet leaves inert, so an export keeps a signed number as written", () => {
    expect(FORMULA_CELL.test("-12.5")).toBe(false);
    expect(FORMULA_CELL.test("+1e-3")).toBe(false);
    expect(isFormulaLike("-12.5 kpc")).toBe(true);
    expect(isFormulaLike("=1+2")).toBe(true);
    expect(isFormulaLike("-1,2")).toBe(true);
  });
});
