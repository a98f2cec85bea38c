import { describe, expect, it } from "vitest";
import { isFormulaLike, neutralizeFormula, toCsvField } from "@/lib/imports/formula";

describe("neutralizeFormula (OWASP: CSV injection)", () => {
  it.each(["=1+2", "+SUM(A1)", "-2+3", "@SUM(A1)", "\tx", "\rx", '=HYPERLINK("http://x","y")'])("prefixes %j with an apostrophe", (text) => {
    expect(neutralizeFormula(text)).toBe(`'${text}`);
  });

  it.each(["-12.5", "+3", "-1e-3", ".5"])("leaves the plain number %j alone: it is inert in a spreadsheet", (text) => {
    expect(isFormulaLike(text)).toBe(false);
    expect(neutralizeFormula(text)).toBe(text);
  });

  it("leaves ordinary text alone, including a formula character later in the text", () => {
    expect(neutralizeFormula("Q0957+561")).toBe("Q0957+561");
    expect(neutralizeFormula("a=b")).toBe("a=b");
  });
});

describe("toCsvField", () => {
  it("writes numbers as they are, negative ones included, and never neutralizes them", () => {
    expect(toCsvField(-12.5)).toBe("-12.5");
    expect(toCsvField(0)).toBe("0");
  });

  it("neutralizes text, then quotes it when it holds a comma, quote or line break (RFC 4180 §2.6–2.7)", () => {
    expect(toCsvField("=1,2")).toBe(`"'=1,2"`);
    expect(toCsvField('say "hi"')).toBe(`"say ""hi"""`);
    expect(toCsvField("two\nlines")).toBe(`"two\nlines"`);
    expect(toCsvField("@x")).toBe("'@x");
  });

  it("writes null and undefined as an empty field and refuses NaN and infinities", () => {
    expect(toCsvField(null)).toBe("");
    expect(toCsvField(undefined)).toBe("");
    expect(() => toCsvField(Number.NaN)).toThrow(RangeError);
    expect(() => toCsvField(Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });
});
