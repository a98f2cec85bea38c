import { describe, expect, it } from "vitest";
import { bundledFontFaceCss, bundledPdfFaces, MATH_FONT_FAMILY } from "@/lib/exports/figures/bundled-font";
import { outlinedSvg, pdfTextRuns } from "@/lib/exports/figures/pdf";
import { resvgSvg } from "@/lib/exports/figures/resvg-text";

/** Letters of target names and authors, and the symbols the plots' and summary's labels use. */
const LETTERS = [..."ŚīāńłŁŌΩθαβλμΔ"];
const SYMBOLS = [..."∝√☉⊙×−≈≤≥±°²µ·–"];

/** The outline resvg draws for one character in the bundled fonts (no system font is loaded). */
function outlineOf(character: string): string {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="40" height="40" viewBox="0 0 40 40"><text x="5" y="30" font-family="Source Sans 3, Noto Sans Math" font-size="24">${character}</text></svg>`;
  return [...outlinedSvg({ svg, widthPx: 40, heightPx: 40 }).matchAll(/ d="([^"]+)"/g)].map(([, d]) => d).join(" ");
}

describe("the figures' glyphs come from the bundled fonts (issue 18, item 4)", () => {
  it("resvg (PNG, and the PDF's outlines) draws every letter and symbol as a glyph, not the missing-glyph box", () => {
    // ✕ is in no bundled face: its outline is the missing-glyph box every uncovered character would get.
    const missing = outlineOf("✕");
    for (const character of [...LETTERS, ...SYMBOLS]) {
      const outline = outlineOf(character);
      expect(outline, character).not.toBe("");
      expect(outline, character).not.toBe(missing);
    }
  });

  it("a line mixing faces is drawn whole, one run per face at its measured place (resvg drew nothing for 'ī Ω')", () => {
    const line = "Śrī Ωmega−1 ∝ M☉";
    const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="300" height="40" viewBox="0 0 300 40"><g font-size="13"><text x="150" y="30" text-anchor="middle" font-weight="600">${line}</text></g></svg>`;
    const runs = pdfTextRuns(line, 600);
    expect(runs.length).toBe(9);
    const laid = resvgSvg(svg);
    const xs = [...laid.matchAll(/<tspan x="([\d.]+)" y="30" font-family="([^"]+)"/g)].map(([, x, family]) => ({ x: Number(x), family }));
    expect(xs.map((run) => run.family)).toEqual(["Arcwright Text Latin Ext", "Source Sans 3", "Arcwright Text Latin Ext", "Source Sans 3", "Arcwright Text Greek", "Source Sans 3", "Noto Sans Math", "Source Sans 3", "Noto Sans Math"]);
    // Left to right, centred on x = 150 as the middle anchor asked.
    for (let i = 1; i < xs.length; i++) expect(xs[i].x).toBeGreaterThan(xs[i - 1].x);
    expect(xs[0].x).toBeGreaterThan(150 - 80);
    expect(xs[0].x).toBeLessThan(150 - 30);
    // An outline per run but the run of one space (before Ω), which has none.
    expect((outlinedSvg({ svg, widthPx: 300, heightPx: 40 }).match(/<path/g) ?? []).length).toBe(runs.length - 1);
    expect(outlineOf("ī Ω")).not.toBe("");
    // A line of one face is left as it was.
    expect(resvgSvg(svg.replace(line, "plain text"))).toBe(svg.replace(line, "plain text"));
  });

  it("the PDF text has a face with the glyph for each of them (Source Sans 3 subsets, then Noto Sans Math), no system font", () => {
    for (const weight of [400, 600] as const) {
      const faces = bundledPdfFaces(weight);
      for (const character of [...LETTERS, ...SYMBOLS]) expect(faces.some((face) => face.hasGlyph(character.codePointAt(0)!)), character).toBe(true);
    }
    expect(pdfTextRuns("Śrī Ωmega−1 ∝ M☉", 400).map((run) => run.font)).toEqual([
      "SourceSans3-latin-ext",
      "SourceSans3",
      "SourceSans3-latin-ext",
      "SourceSans3",
      "SourceSans3-greek",
      "SourceSans3",
      "NotoSansMath",
      "SourceSans3",
      "NotoSansMath",
    ]);
  });

  it("an SVG carries the symbol face only when its text needs it", () => {
    expect(bundledFontFaceCss("area ∝ |μ|")).toContain(`font-family:"${MATH_FONT_FAMILY}"`);
    expect(bundledFontFaceCss("Śrī Ωmega−1")).not.toContain(MATH_FONT_FAMILY);
  });
});
