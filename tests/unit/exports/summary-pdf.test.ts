import { PDFParse } from "pdf-parse";
import { describe, expect, it } from "vitest";
import { pdfTextRuns, PDF_FONT, PDF_FONT_SEMIBOLD } from "@/lib/exports/figures/pdf";
import { technicalSummaryPdf } from "@/lib/exports/figures/summary-pdf";
import { summaryCaseOf } from "@/lib/exports/case-summary";
import { tableColumnsQuerySchema } from "@/lib/exports/tables/columns";
import { exportProvenance, exportRows } from "./fixtures";

/** The text a PDF reader extracts from the document. */
async function pdfText(pdf: Uint8Array): Promise<string> {
  const parser = new PDFParse({ data: pdf });
  const { text } = await parser.getText();
  await parser.destroy();
  return text;
}

const table = { title: "Arcs", columns: tableColumnsQuerySchema.parse({ columns: "name,einsteinRadiusMas" }), rows: exportRows, provenance: exportProvenance };

describe("technical summary: each target's science case in sentences (issue 16, item 6)", () => {
  it("states the case, whether it was inferred, and each answer's verdict with its number, sentence and source", () => {
    const [point, galaxy] = exportRows.map(summaryCaseOf);
    expect(point.caseText).toBe("Photometric microlensing event (inferred from the model and numbers)");
    expect(point.answers[1]).toEqual({
      question: "Visits over the event (t0 ± t_E)",
      verdict: "marginal",
      verdictText: "Marginal (6 visits)",
      sentence: "The schedule collects 6 visits within t0 ± t_E.",
      source: "Common practice",
    });
    expect(point.answers[2].verdictText).toBe("Not feasible");
    expect(galaxy.caseText).toBe("Resolved multiple images (chosen by the team)");
    expect(summaryCaseOf({ ...exportRows[1], answeredCase: null }).caseText).toMatch(/no lens solution/);
  });

  it("prints them in the PDF after the table, the old verdict columns gone", async () => {
    const text = await pdfText(await technicalSummaryPdf(table, [], exportProvenance));
    expect(text).toContain("Science cases");
    expect(text).toContain("Photometric microlensing event (inferred from the model and numbers)");
    expect(text).toContain("Marginal (6 visits).");
    expect(text).toContain("The schedule collects 6 visits within t0 ± t");
    expect(text).toContain("Rule: Paczyński 1986, ApJ 304, 1");
    expect(text).not.toMatch(/Resolution verdict/);
  });

  it("writes the table's numbers for people, the data files' machine form left to the data files", async () => {
    const rows = [{ ...exportRows[0], einsteinRadiusMas: -1.5e-7 }];
    const text = await pdfText(await technicalSummaryPdf({ ...table, rows }, [], exportProvenance));
    // The exponent is drawn (raised, as normal digits in smaller type: the bundled faces have no
    // superscript digits), where it used to be dropped with its missing glyphs.
    expect(text).toContain("−1.5 × 10−7");
    expect(text).not.toContain("1.5e-7");
  });

  it("states the hours the proposal asks for, summed over the targets' photon budgets (issue 17, item 5)", async () => {
    const rows = [{ ...exportRows[0], timeRequestHours: 3.25 }, { ...exportRows[1], timeRequestHours: 1.5 }, { ...exportRows[1], id: "third", timeRequestHours: null }];
    const text = await pdfText(await technicalSummaryPdf({ ...table, rows }, [], exportProvenance));
    expect(text).toContain("Time requested: 4.75 h (exposures and overheads over the visits each case needs) for 2 of 3 targets; 1 without a photon budget");
  });

  it("keeps the Greek and Latin-extended letters of the answers (the PDF's Latin font alone dropped the ń of Paczyński)", async () => {
    const answer = { ...exportRows[0].caseAnswers[0], sentence: "The shadow spans 1.7 λ/B; Δt = 3 d; θ_E = 0.64 mas." };
    const text = await pdfText(await technicalSummaryPdf({ ...table, title: "Łódź arcs", rows: [{ ...exportRows[0], name: "HE 0435−1223 Ω", caseAnswers: [answer] }] }, [], exportProvenance));
    expect(text).toContain("The shadow spans 1.7 λ/B; Δt = 3 d; θ_E = 0.64 mas.");
    expect(text).toContain("Paczyński");
    // The title and the table's cells too.
    expect(text).toContain("Technical summary: Łódź arcs");
    expect(text).toContain("HE 0435−1223 Ω 0.6372");
  });

  it("cuts a text into runs per font: Latin, Latin extended, Greek, then the bundled Noto Sans Math for symbols", () => {
    const fontsAndTexts = (text: string, weight: 400 | 600) => pdfTextRuns(text, weight).map(({ font, text: run }) => ({ font, text: run }));
    expect(fontsAndTexts("Paczyński θ_E ☉", 400)).toEqual([
      { font: PDF_FONT, text: "Paczy" },
      { font: `${PDF_FONT}-latin-ext`, text: "ń" },
      { font: PDF_FONT, text: "ski " },
      { font: `${PDF_FONT}-greek`, text: "θ" },
      { font: PDF_FONT, text: "_E " },
      { font: "NotoSansMath", text: "☉" },
    ]);
    // A character no bundled face has stays in the text face (drawn as its missing-glyph box, not dropped from the run).
    expect(fontsAndTexts("M✕", 600)).toEqual([{ font: PDF_FONT_SEMIBOLD, text: "M✕" }]);
  });

  it("raises a power of ten's superscript digits in smaller type (no bundled face has U+2070–U+207F)", () => {
    expect(pdfTextRuns("4.1 × 10⁻¹² M☉", 400).map(({ text, isRaised }) => ({ text, isRaised }))).toEqual([
      { text: "4.1 × 10", isRaised: false },
      { text: "−12", isRaised: true },
      { text: " M", isRaised: false },
      { text: "☉", isRaised: false },
    ]);
  });
});
