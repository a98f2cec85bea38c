import { describe, expect, it } from "vitest";
import { parseFitsHeader } from "@/lib/imports/fits-header";
import { card, fitsFile } from "./fits";
import { refusal } from "./refusal";

const image = [card("SIMPLE", "T", "conforms to FITS"), card("BITPIX", "-32"), card("NAXIS", "2"), card("NAXIS1", "100"), card("NAXIS2", "50")];

describe("parseFitsHeader (FITS Standard 4.0)", () => {
  it("reads keywords with values as written and comments, and the data size |BITPIX|/8 × ΠNAXISn (§4.4.1.1)", () => {
    const file = parseFitsHeader(fitsFile([...image, card("EXPTIME", "1.2D+3", "seconds"), card("OBJECT", "'Lantern Arc'"), card("FLAG", "F")], 20_000));
    const header = file.hdus[0];
    expect(file.hdus).toHaveLength(1);
    expect(header.type).toBe("PRIMARY");
    expect(header.bitpix).toBe(-32);
    expect(header.axes).toEqual([100, 50]);
    expect(header.dataBytes).toBe(4 * 100 * 50);
    expect(header.headerBytes).toBe(2880);
    expect(file.isTruncated).toBe(false);
    expect(header.keywords.slice(0, 2)).toEqual([
      { key: "SIMPLE", text: "T", isString: false, comment: "conforms to FITS" },
      { key: "BITPIX", text: "-32", isString: false, comment: "" },
    ]);
    expect(header.keywords.slice(5)).toEqual([
      { key: "EXPTIME", text: "1.2D+3", isString: false, comment: "seconds" },
      { key: "OBJECT", text: "Lantern Arc", isString: true, comment: "" },
      { key: "FLAG", text: "F", isString: false, comment: "" },
    ]);
  });

  it("reads quotes doubled inside a string, a slash inside a string, and drops trailing spaces (§4.2.1.1)", () => {
    const [header] = parseFitsHeader(fitsFile([...image, "OBSERVER= 'O''Neil / night 2   ' / who"], 20_000)).hdus;
    expect(header.keywords.at(-1)).toEqual({ key: "OBSERVER", text: "O'Neil / night 2", isString: true, comment: "who" });
  });

  it("keeps commentary cards (COMMENT, HISTORY, blank keyword) as text (§4.4.2.4)", () => {
    const [header] = parseFitsHeader(fitsFile([...image, "COMMENT   reduced with flat 12", "HISTORY bias subtracted", "        spacer"], 20_000)).hdus;
    expect(header.keywords.slice(5)).toEqual([
      { key: "COMMENT", text: null, isString: false, comment: "reduced with flat 12" },
      { key: "HISTORY", text: null, isString: false, comment: "bias subtracted" },
      { key: "", text: null, isString: false, comment: "spacer" },
    ]);
  });

  it("gives 0 data bytes for NAXIS = 0 and counts a header of more than 36 cards as two blocks (§3.1, §4.4.1.1)", () => {
    const cards = [card("SIMPLE", "T"), card("BITPIX", "8"), card("NAXIS", "0"), ...Array.from({ length: 40 }, (_, i) => card(`KEY${i}`, String(i)))];
    const [header] = parseFitsHeader(fitsFile(cards)).hdus;
    expect(header.dataBytes).toBe(0);
    expect(header.headerBytes).toBe(2 * 2880);
  });

  it("counts random groups without NAXIS1 and with GCOUNT × (PCOUNT + ΠNAXISn) (§6.1)", () => {
    const groups = [card("SIMPLE", "T"), card("BITPIX", "16"), card("NAXIS", "3"), card("NAXIS1", "0"), card("NAXIS2", "3"), card("NAXIS3", "4"), card("GROUPS", "T"), card("PCOUNT", "2"), card("GCOUNT", "10")];
    expect(parseFitsHeader(fitsFile(groups, 280)).hdus[0].dataBytes).toBe(2 * 10 * (2 + 12));
  });

  it("says when the file is shorter than its header and data", () => {
    expect(parseFitsHeader(fitsFile(image, 100)).isTruncated).toBe(true);
  });

  it("refuses a header without END, with a bad BITPIX, without NAXISn, or with non-ASCII bytes", () => {
    const noEnd = fitsFile(image);
    noEnd.fill(0x20, 5 * 80, 6 * 80);
    expect(refusal(() => parseFitsHeader(noEnd)).message).toBe("The FITS file's header is not valid: it has no END card.");
    expect(refusal(() => parseFitsHeader(fitsFile([card("SIMPLE", "T"), card("BITPIX", "12"), card("NAXIS", "0")]))).message).toMatch(/BITPIX must be one of 8, 16, 32, 64, -32, -64 \(got 12\)/);
    expect(refusal(() => parseFitsHeader(fitsFile([card("SIMPLE", "T"), card("BITPIX", "8"), card("NAXIS", "1")]))).message).toMatch(/NAXIS1 must be an integer ≥ 0 and is missing/);
    const binary = fitsFile(image);
    binary[85] = 0xc3;
    expect(refusal(() => parseFitsHeader(binary)).message).toMatch(/card 2 holds a byte outside printable ASCII/);
  });

  it("refuses a header that does not start with SIMPLE = T, or shorter than one block", () => {
    expect(refusal(() => parseFitsHeader(fitsFile([card("SIMPLE", "F"), card("BITPIX", "8"), card("NAXIS", "0")]))).message).toMatch(/the first card must be SIMPLE = T/);
    expect(refusal(() => parseFitsHeader(new TextEncoder().encode(card("SIMPLE", "T")))).message).toMatch(/at least one 2880-byte block/);
  });

  it("refuses NAXISn whose product cannot exist rather than overflowing", () => {
    const huge = [card("SIMPLE", "T"), card("BITPIX", "64"), card("NAXIS", "3"), card("NAXIS1", "999999999"), card("NAXIS2", "999999999"), card("NAXIS3", "999999")];
    expect(refusal(() => parseFitsHeader(fitsFile(huge))).message).toMatch(/too large to exist/);
  });
});
