import { provenanceLines } from "@/lib/exports/provenance";
import { cellOf, cellText, type ChosenColumn } from "./columns";
import { latexText } from "./latex-text";
import { sexagesimalCompanionOf, singleLine, type SexagesimalColumn, type TargetTable } from "./table";
import type { TargetView } from "@/lib/workspace/target-view";

/**
 * How a LaTeX table meets the text width (our names): `shrink` scales the table down to the line
 * width when it is wider (never up); `landscape` turns it onto a page of its own (`sidewaystable`),
 * shrunk to the page's length if still wider; `split` cuts the columns into several tables sized by
 * estimate to fit, the first column repeated in each. Every table is also shrunk to the page's
 * height when taller (see `float`), so none runs over the page.
 */
export const latexFits = ["shrink", "landscape", "split"] as const;
export type LatexFit = (typeof latexFits)[number];

/** A number as LaTeX: negatives with a true minus, exponent forms as $m\times10^{e}$, as astronomers write them. */
function latexNumber(text: string): string {
  const exponential = /^(-?[\d.]+)e([+-]?\d+)$/.exec(text);
  if (exponential) return `$${exponential[1]}\\times10^{${Number(exponential[2])}}$`;
  if (/^-?Infinity$/.test(text)) return `$${text.replace("Infinity", "\\infty")}$`;
  return text.startsWith("-") ? `$${text}$` : text;
}

/** Width of a paragraph column (the case's answers): about half an A4 text block. */
const PARAGRAPH_WIDTH_CM = 7;
const PT_PER_CM = 72.27 / 2.54;
/** \textwidth of LaTeX's article class at 10 pt, the width `split` sizes its parts for. */
const SPLIT_TEXT_WIDTH_PT = 345;
/** Mean width of a character of Computer Modern Roman 10 pt (digits are 5 pt; from memory of cmr10's metrics). */
const CHARACTER_WIDTH_PT = 5;
/** 2\tabcolsep of the standard classes: the space around each column. */
const COLUMN_PADDING_PT = 12;

/**
 * A column as the LaTeX table sets it: a chosen export column, or the sexagesimal form of RA or Dec
 * written after its degrees (`sexagesimalColumns`).
 */
interface LatexColumn {
  label: string;
  /** The unit in LaTeX, "" for none. */
  latexUnit: string;
  /** The unit's printed length in characters, for width estimates. */
  unitLength: number;
  /** Text left, numbers right (common practice). */
  side: "l" | "r";
  isParagraph: boolean;
  /** The cell as LaTeX source. */
  latex: (row: TargetView) => string;
  /** The cell's printed length in characters, for width estimates. */
  printedLength: (row: TargetView) => number;
}

function chosenLatexColumn(chosen: ChosenColumn): LatexColumn {
  const { column } = chosen;
  return {
    label: column.label,
    latexUnit: column.latexUnit,
    unitLength: column.unit.length,
    side: column.kind === "text" ? "l" : "r",
    isParagraph: column.isParagraph === true,
    latex: (row) => {
      const value = cellOf(row, column);
      if (value === null) return "--";
      return typeof value === "number" ? latexNumber(cellText(value, chosen)) : latexText(singleLine(value));
    },
    printedLength: (row) => cellText(cellOf(row, column), chosen).length,
  };
}

/** "17:45:40.036" as it is; "-29:00:28.17" with a true minus before the colons, which math mode would space. */
function sexagesimalLatexColumn({ after, column, text }: SexagesimalColumn): LatexColumn {
  return {
    label: column.label,
    latexUnit: "",
    unitLength: 0,
    side: "r",
    isParagraph: false,
    latex: (row) => text(row[after] as number).replace(/^-/, "$-$"),
    printedLength: (row) => text(row[after] as number).length,
  };
}

/** The table's columns in order: each chosen column, RA and Dec each followed by their sexagesimal form. */
function latexColumnsOf(table: TargetTable): LatexColumn[] {
  return table.columns.flatMap((chosen) => {
    const companion = sexagesimalCompanionOf(chosen.column.key);
    return companion === undefined ? [chosenLatexColumn(chosen)] : [chosenLatexColumn(chosen), sexagesimalLatexColumn(companion)];
  });
}

function alignmentOf(column: LatexColumn): string {
  return column.isParagraph ? `p{${PARAGRAPH_WIDTH_CM}cm}` : column.side;
}

/** Labels longer than this many characters are set on two lines. */
const MAX_LABEL_LINE_LENGTH = 12;

/** A label as one or two lines, broken at the space nearest its middle. */
function labelLines(label: string): string[] {
  if (label.length <= MAX_LABEL_LINE_LENGTH) return [label];
  const spaces = [...label.matchAll(/ /g)].map((match) => match.index);
  if (spaces.length === 0) return [label];
  const middle = spaces.reduce((best, at) => (Math.abs(at - label.length / 2) < Math.abs(best - label.length / 2) ? at : best));
  return [label.slice(0, middle), label.slice(middle + 1)];
}

/** A header cell: a two-line label stacked in a tabular of its own (no package needed), aligned as its column. */
function headerLatex(column: LatexColumn): string {
  const lines = labelLines(column.label).map(latexText);
  if (lines.length === 1) return lines[0];
  return `\\begin{tabular}[b]{@{}${column.side}@{}}${lines.join(" \\\\ ")}\\end{tabular}`;
}

/** A column's estimated typeset width in points: its widest header line or cell, plus padding. */
function estimatedWidthPt(table: TargetTable, column: LatexColumn): number {
  if (column.isParagraph) return PARAGRAPH_WIDTH_CM * PT_PER_CM + COLUMN_PADDING_PT;
  const lengths = [...labelLines(column.label).map((line) => line.length), column.unitLength + 2, ...table.rows.map(column.printedLength)];
  return Math.max(...lengths) * CHARACTER_WIDTH_PT + COLUMN_PADDING_PT;
}

/** The columns cut into parts that each fit `SPLIT_TEXT_WIDTH_PT` by estimate, the first column leading each part. */
function columnParts(table: TargetTable, columns: LatexColumn[]): LatexColumn[][] {
  const [first, ...rest] = columns;
  const firstWidthPt = estimatedWidthPt(table, first);
  const parts: LatexColumn[][] = [[first]];
  let widthPt = firstWidthPt;
  for (const column of rest) {
    const columnWidthPt = estimatedWidthPt(table, column);
    if (widthPt + columnWidthPt > SPLIT_TEXT_WIDTH_PT && parts.at(-1)!.length > 1) {
      parts.push([first]);
      widthPt = firstWidthPt;
    }
    parts.at(-1)!.push(column);
    widthPt += columnWidthPt;
  }
  return parts;
}

/** A `tabular` of some columns: labels, then units (when any column has one), then the rows. */
function tabular(table: TargetTable, columns: LatexColumn[]): string[] {
  const labels = columns.map(headerLatex).join(" & ");
  const hasUnits = columns.some((column) => column.latexUnit !== "");
  const units = columns.map((column) => (column.latexUnit === "" ? "" : `(${column.latexUnit})`)).join(" & ");
  return [
    `\\begin{tabular}{${columns.map(alignmentOf).join("")}}`,
    "\\hline",
    `${labels} \\\\`,
    ...(hasUnits ? [`${units} \\\\`] : []),
    "\\hline",
    ...table.rows.map((row) => `${columns.map((column) => column.latex(row)).join(" & ")} \\\\`),
    "\\hline",
    "\\end{tabular}",
  ];
}

/**
 * One float: caption and label above the table (common practice for tables), then the table scaled
 * down (never up) to the line's width and, when still taller, to the page: 90% of the text height,
 * room left for the caption (our rule), or of the text width for a `sidewaystable`, whose height
 * runs across the page.
 */
function float(environment: "table" | "sidewaystable", caption: string, label: string, body: string[]): string[] {
  const maxHeight = environment === "sidewaystable" ? "0.9\\textwidth" : "0.9\\textheight";
  return [
    `\\begin{${environment}}`,
    "\\centering",
    `\\caption{${caption}}`,
    `\\label{${label}}`,
    `\\resizebox*{!}{\\ifdim\\totalheight>${maxHeight}${maxHeight}\\else\\totalheight\\fi}{%`,
    "\\resizebox{\\ifdim\\width>\\linewidth\\linewidth\\else\\width\\fi}{!}{%",
    ...body,
    "}}",
    `\\end{${environment}}`,
  ];
}

/** The preamble a table of `fit` needs, stated in its comment: the `% Preamble:` line is meant to be copied as it is. */
function preambleLines(fit: LatexFit): string[] {
  const rotating = fit === "landscape" ? " \\usepackage{rotating}" : "";
  return [
    `% Preamble: \\usepackage[T1]{fontenc} \\usepackage{lmodern} \\usepackage{graphicx}${rotating}`,
    "% (T1: accented letters as single glyphs, and letters with an ogonek, eth, thorn, eng or d with stroke exist only",
    `% in T1; lmodern: outline fonts for T1, or any T1 font family; graphicx: \\resizebox${rotating === "" ? "" : "; rotating: sidewaystable"}.)`,
  ];
}

/**
 * The table as LaTeX: `%` comment lines with the provenance and the preamble the document needs,
 * then one `table` float (a `sidewaystable` for `landscape`, several for `split`) with a caption
 * and a label (`tab:targets`, then `tab:targets-2`, … for the parts of a split). The table's
 * source is printable ASCII whatever the target names hold (`latexText`). RA and Dec are each followed
 * by their sexagesimal form, as proposal forms ask for them. Text columns left-aligned
 * (a paragraph column wrapped), numbers right; a value the model does not give is an en dash.
 */
export function targetTableLatex(table: TargetTable, fit: LatexFit = "shrink"): string {
  const comments = provenanceLines(table.provenance).map((line) => `% ${singleLine(line)}`);
  const caption = `Targets of the proposal \`\`${latexText(singleLine(table.title))}''.`;
  const columns = latexColumnsOf(table);
  const parts = fit === "split" ? columnParts(table, columns) : [columns];
  const floats = parts.flatMap((columns, index) => {
    const partCaption = parts.length === 1 ? caption : `${caption} Part ${index + 1} of ${parts.length}.`;
    const label = index === 0 ? "tab:targets" : `tab:targets-${index + 1}`;
    return float(fit === "landscape" ? "sidewaystable" : "table", partCaption, label, tabular(table, columns));
  });
  return [...comments, ...preambleLines(fit), ...floats, ""].join("\n");
}
