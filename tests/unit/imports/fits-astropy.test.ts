import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { FITS_BLOCK_BYTES, parseFitsHeader } from "@/lib/imports/fits-header";
import { MAX_FITS_CARDS_PER_HDU, MAX_FITS_HDUS } from "@/lib/imports/limits";
import { card, fitsFile } from "./fits";

// Reference: astropy.io.fits's reading of the same file, written by tests/fixtures/generate_fits.py.
const fixtures = path.join(__dirname, "../../fixtures/fits");
const bytes = new Uint8Array(readFileSync(path.join(fixtures, "multi-extension.fits")));
interface AstropyCard {
  keyword: string;
  isString: boolean;
  valueText: string | null;
  comment: string;
}
interface AstropyHdu {
  type: string;
  bitpix: number;
  axes: number[];
  headerOffset: number;
  dataBytes: number;
  dataSpanBytes: number;
  cards: AstropyCard[];
}
const astropy = JSON.parse(readFileSync(path.join(fixtures, "multi-extension.json"), "utf8")) as { sizeBytes: number; hdus: AstropyHdu[] };

describe("parseFitsHeader against astropy.io.fits", () => {
  const file = parseFitsHeader(bytes);

  it("lists every HDU with its type, BITPIX, axes and data size, skipping each padded data unit (FITS 4.0 §4.4.1)", () => {
    expect(file.hasMoreHdus).toBe(false);
    expect(file.isTruncated).toBe(false);
    expect(file.hdus.map((h) => [h.type, h.bitpix, h.axes, h.dataBytes])).toEqual(astropy.hdus.map((h) => [h.type, h.bitpix, h.axes, h.dataBytes]));
    let offset = 0;
    file.hdus.forEach((hdu, i) => {
      expect(offset).toBe(astropy.hdus[i].headerOffset);
      offset += hdu.headerBytes + Math.ceil(hdu.dataBytes / FITS_BLOCK_BYTES) * FITS_BLOCK_BYTES;
    });
    expect(offset).toBe(astropy.sizeBytes);
  });

  it("reads every card as astropy does: CONTINUE joined (§4.2.1.2), HIERARCH keywords (ESO convention), values as written, '' read as '", () => {
    file.hdus.forEach((hdu, i) => {
      expect(hdu.keywords.map((k) => ({ keyword: k.key, isString: k.isString, valueText: k.text, comment: k.comment }))).toEqual(
        astropy.hdus[i].cards.map(({ keyword, isString, valueText, comment }) => ({ keyword, isString, valueText, comment })),
      );
    });
    const primary = new Map(file.hdus[0].keywords.map((k) => [k.key, k]));
    expect(primary.get("EXPTIME")?.text).toBe("300.0");
    expect(primary.get("WAVELEN")?.text).toBe("1.5E-07");
    expect(primary.get("PHOTOMET")?.text).toBe("T");
    expect(primary.get("OBSERVER")?.text).toBe("O'Neil and d'Arcy");
    expect(primary.get("LONGSTR")?.text).toMatch(/^A long string .* end of each part$/);
    expect(primary.get("ESO DET CHIP NAME")).toEqual({ key: "ESO DET CHIP NAME", text: "CCD-44", isString: true, comment: "detector chip" });
  });
});

describe("parseFitsHeader bounds (our rule: lib/imports/limits.ts)", () => {
  const primary = [card("SIMPLE", "T"), card("BITPIX", "8"), card("NAXIS", "0"), card("EXTEND", "T")];
  const extension = fitsFile([card("XTENSION", "'IMAGE   '"), card("BITPIX", "8"), card("NAXIS", "1"), card("NAXIS1", "10"), card("PCOUNT", "0"), card("GCOUNT", "1")], 10);

  it(`lists at most ${MAX_FITS_HDUS} HDUs and says more follow`, () => {
    const parts = [fitsFile(primary), ...Array.from({ length: MAX_FITS_HDUS + 5 }, () => extension)];
    const joined = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
    parts.reduce((at, p) => (joined.set(p, at), at + p.length), 0);
    const file = parseFitsHeader(joined);
    expect(file.hdus).toHaveLength(MAX_FITS_HDUS);
    expect(file.hasMoreHdus).toBe(true);
    expect(file.hdus[1]).toMatchObject({ type: "IMAGE", axes: [10], dataBytes: 10 });
  });

  it(`keeps at most ${MAX_FITS_CARDS_PER_HDU} cards of a header and counts the rest`, () => {
    const many = Array.from({ length: MAX_FITS_CARDS_PER_HDU + 20 }, (_, i) => card(`K${i}`, String(i)));
    const [hdu] = parseFitsHeader(fitsFile([...primary, ...many])).hdus;
    expect(hdu.keywords).toHaveLength(MAX_FITS_CARDS_PER_HDU);
    expect(hdu.omittedCards).toBe(primary.length + 20);
  });

  it("stops at trailing bytes that are not an extension, and says when an extension's data is cut short", () => {
    const trailing = new Uint8Array(2 * FITS_BLOCK_BYTES);
    trailing.set(fitsFile(primary));
    expect(parseFitsHeader(trailing).hdus).toHaveLength(1);
    const cut = new Uint8Array(2 * FITS_BLOCK_BYTES);
    cut.set(fitsFile(primary));
    cut.set(extension.subarray(0, FITS_BLOCK_BYTES), FITS_BLOCK_BYTES);
    const file = parseFitsHeader(cut);
    expect(file.hdus.map((h) => h.type)).toEqual(["PRIMARY", "IMAGE"]);
    expect(file.isTruncated).toBe(true);
  });
});
