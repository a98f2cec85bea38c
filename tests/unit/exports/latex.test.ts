import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { exportColumnKeys, tableColumnsQuerySchema } from "@/lib/exports/tables/columns";
import { tableWriteOptionsSchema } from "@/lib/exports/tables/formats";
import { targetTableLatex } from "@/lib/exports/tables/latex";
import { latexText } from "@/lib/exports/tables/latex-text";
import { sexagesimalColumns, type TargetTable } from "@/lib/exports/tables/table";
import { exportProvenance, exportRows } from "./fixtures";
import { bracesBalance } from "./latex-support";

describe("text as LaTeX (latexText)", () => {
  it("writes a minus sign copied from a paper (U+2212) as a math minus: pdflatex stopped at HE 0435−1223", () => {
    expect(latexText("HE 0435\u22121223")).toBe("HE 0435$-$1223");
  });

  it("sets Greek letters in math mode, the capitals that look Latin as Latin letters, and runs of symbols in one $…$", () => {
    expect(latexText("Ω Cen")).toBe("$\\Omega$ Cen");
    expect(latexText("αβ Α")).toBe("$\\alpha\\beta$ A");
    expect(latexText("θ_E ≈ 1″")).toBe("$\\theta$\\_E $\\approx$ 1${}^{\\prime\\prime}$");
    expect(latexText("10°20′")).toBe("10${}^{\\circ}$20${}^{\\prime}$");
  });

  it("writes accented letters as accent commands, dotless under an accent (Lamport 1994, §3.2.1), decomposed or not", () => {
    expect(latexText("Ściśle Mihālī")).toBe("\\'{S}ci\\'{s}le Mih\\={a}l\\={\\i}");
    expect(latexText("S\u0301")).toBe("\\'{S}");
    expect(latexText("Świątek Øster ß ł")).toBe("\\'{S}wi\\k{a}tek \\O{}ster \\ss{} \\l{}");
  });

  it("escapes the ten special characters and the brackets a row's \\\\ would read", () => {
    expect(latexText("A&B_{1}% $5 #2 ~^\\")).toBe("A\\&B\\_\\{1\\}\\% \\$5 \\#2 \\textasciitilde{}\\textasciicircum{}\\textbackslash{}");
    expect(latexText("[OII] <x> |y|")).toBe("{[}OII{]} \\textless{}x\\textgreater{} \\textbar{}y\\textbar{}");
    expect(latexText("*star")).toBe("{*}star");
  });

  it("keeps -- ,, '' apart (TeX's ligatures would make an en dash and quotes), but turns typographic dashes and quotes into LaTeX's", () => {
    expect(latexText("a--b ,, ''")).toBe("a-{}-b ,{}, '{}'");
    expect(latexText("a–b “c”")).toBe("a--b ``c''");
  });

  it("writes an emoji (or any character with no LaTeX form) as its code point, dropping joiners and variation selectors", () => {
    expect(latexText("Lens 🔭")).toBe("Lens {[}U+1F52D{]}");
    expect(latexText("👨\u200d🚀\ufe0f")).toBe("{[}U+1F468{]}{[}U+1F680{]}");
    expect(latexText("a\u0007b")).toBe("a{[}U+0007{]}b");
  });

  it("gives printable ASCII with balanced braces for any text (property)", () => {
    fc.assert(
      fc.property(fc.string({ unit: "binary", maxLength: 40 }), (text) => {
        const latex = latexText(text);
        expect(latex).toMatch(/^[\x20-\x7e]*$/);
        expect(bracesBalance(latex)).toBe(true);
        expect((latex.replace(/\\\$/g, "").match(/\$/g) ?? []).length % 2).toBe(0);
      }),
    );
  });
});

const columns = tableColumnsQuerySchema.parse({ columns: "name,raDeg,decDeg,lensModel,einsteinRadiusMas,timeDelayDays,priority" });
const table: TargetTable = { title: "Arcs & “Ω”", columns, rows: exportRows, provenance: exportProvenance };

describe("LaTeX table layout", () => {
  it("is a table float with a caption and a label, scaled down only when wider than the line", () => {
    const tex = targetTableLatex(table);
    expect(tex).toContain("\\begin{table}\n\\centering\n\\caption{Targets of the proposal ``Arcs \\& ``$\\Omega$''''.}\n\\label{tab:targets}");
    expect(tex).toContain("\\resizebox*{!}{\\ifdim\\totalheight>0.9\\textheight0.9\\textheight\\else\\totalheight\\fi}{%\n\\resizebox{\\ifdim\\width>\\linewidth\\linewidth\\else\\width\\fi}{!}{%\n\\begin{tabular}{lrrrrlrrr}");
    expect(tex).toContain("\\end{tabular}\n}}\n\\end{table}\n");
    expect(tex).toContain("% Preamble: \\usepackage[T1]{fontenc} \\usepackage{lmodern} \\usepackage{graphicx}\n");
    expect(bracesBalance(tex)).toBe(true);
  });

  it("writes negative numbers with a true minus (the declination had a hyphen) and exponents as ×10^e", () => {
    const rows = targetTableLatex(table).split("\n").filter((line) => line.endsWith("\\\\"));
    // RA and Dec each followed by their sexagesimal form, the Dec's minus a true one before the colons.
    expect(rows[2]).toBe("TB-ML-0001 & 269.301667 & 17:57:12.400 & $-29.2013889$ & $-$29:12:05.00 & point & 0.6372 & $1.235\\times10^{-7}$ & 2 \\\\");
    expect(rows[3]).toContain("& 150.1 & 10:00:24.000 & 2.2 & +02:12:00.00 & sis & 1031 & -- & 5 \\\\");
  });

  it("puts the units on a second header row and sets a long label on two lines", () => {
    const rows = targetTableLatex(table).split("\n").filter((line) => line.endsWith("\\\\"));
    expect(rows[0]).toBe(
      "Name & RA (ICRS) & \\begin{tabular}[b]{@{}r@{}}RA (ICRS) \\\\ hms\\end{tabular} & Dec (ICRS) & \\begin{tabular}[b]{@{}r@{}}Dec (ICRS) \\\\ dms\\end{tabular} & Lens model & \\begin{tabular}[b]{@{}r@{}}Einstein \\\\ radius\\end{tabular} & Time delay & Priority \\\\",
    );
    expect(rows[1]).toBe(" & (deg) &  & (deg) &  &  & (mas) & (d) &  \\\\");
  });

  it("turns a landscape table on its page with sidewaystable and names the rotating package it needs", () => {
    const tex = targetTableLatex(table, "landscape");
    expect(tex).toContain("\\begin{sidewaystable}\n\\centering\n\\caption{");
    expect(tex).toContain("\\end{sidewaystable}");
    expect(tex).toContain("\\usepackage{graphicx} \\usepackage{rotating}\n");
  });

  it("splits every column into parts that repeat the first, each with its own caption and label", () => {
    const all = tableColumnsQuerySchema.parse({ columns: exportColumnKeys.join(",") });
    const tex = targetTableLatex({ ...table, columns: all }, "split");
    const alignments = [...tex.matchAll(/^\\begin\{tabular\}\{(.+)\}$/gm)].map((match) => match[1].replace(/p\{7cm\}/, "p"));
    expect(alignments.length).toBeGreaterThan(3);
    // Every column once (RA and Dec with their sexagesimal forms), the name column leading each part.
    expect(alignments.reduce((count, alignment) => count + alignment.length - 1, 1)).toBe(all.length + sexagesimalColumns.length);
    expect([...tex.matchAll(/\\label\{(.+)\}/g)].map((match) => match[1])).toEqual(alignments.map((_, i) => (i === 0 ? "tab:targets" : `tab:targets-${i + 1}`)));
    expect(tex).toContain(`Part ${alignments.length} of ${alignments.length}.}`);
    const firstCells = tex.split("\n").filter((line) => line.startsWith("TB-ML-0001 &"));
    expect(firstCells).toHaveLength(alignments.length);
  });

  it("takes its layout from the query's fit (shrink unless named) and refuses an unknown one by name", () => {
    expect(tableWriteOptionsSchema.parse({})).toEqual({ fit: "shrink" });
    expect(tableWriteOptionsSchema.parse({ fit: "split" })).toEqual({ fit: "split" });
    const refused = tableWriteOptionsSchema.safeParse({ fit: "tiny" });
    expect(refused.error?.issues[0].path).toEqual(["fit"]);
    expect(refused.error?.issues[0].message).toBe("The LaTeX table layout must be one of shrink, landscape, split.");
  });
});
