import { provenanceLines } from "@/lib/exports/provenance";
import { cellOf, cellText, type ExportColumn } from "./columns";
import { singleLine, type TargetTable } from "./table";

const latexEscapes: Record<string, string> = {
  "\\": "\\textbackslash{}",
  "&": "\\&",
  "%": "\\%",
  $: "\\$",
  "#": "\\#",
  _: "\\_",
  "{": "\\{",
  "}": "\\}",
  "~": "\\textasciitilde{}",
  "^": "\\textasciicircum{}",
};

/** Text safe in a LaTeX paragraph or table cell: the ten special characters escaped in one pass. */
export function escapeLatex(text: string): string {
  return text.replace(/[\\&%$#_{}~^]/g, (c) => latexEscapes[c]);
}

/** A number as LaTeX: exponent forms become $m\times10^{e}$, so they typeset as astronomers write them. */
function latexNumber(text: string): string {
  const match = /^(-?[\d.]+)e([+-]?\d+)$/.exec(text);
  if (!match) return text;
  const exponent = Number(match[2]);
  return `$${match[1]}\\times10^{${exponent}}$`;
}

function latexHeader(column: ExportColumn): string {
  const label = escapeLatex(column.label);
  return column.latexUnit === "" ? label : `${label} (${column.latexUnit})`;
}

/** Width of a paragraph column (the case's answers): about half an A4 text block. */
const PARAGRAPH_WIDTH = "7cm";

/**
 * The table as a plain LaTeX `tabular` (no package needed: compiles with the LaTeX kernel alone),
 * preceded by `%` comment lines holding the provenance. Text columns left-aligned (a paragraph
 * column wrapped), numbers right; a value the model does not give is an en dash.
 */
export function targetTableLatex(table: TargetTable): string {
  const comments = provenanceLines(table.provenance).map((line) => `% ${singleLine(line)}`);
  const alignment = table.columns.map(({ column }) => (column.isParagraph ? `p{${PARAGRAPH_WIDTH}}` : column.kind === "text" ? "l" : "r")).join("");
  const header = table.columns.map(({ column }) => latexHeader(column)).join(" & ");
  const rows = table.rows.map((row) =>
    table.columns
      .map((chosen) => {
        const value = cellOf(row, chosen.column);
        if (value === null) return "--";
        return typeof value === "number" ? latexNumber(cellText(value, chosen)) : escapeLatex(singleLine(value));
      })
      .join(" & "),
  );
  return [
    ...comments,
    `\\begin{tabular}{${alignment}}`,
    "\\hline",
    `${header} \\\\`,
    "\\hline",
    ...rows.map((r) => `${r} \\\\`),
    "\\hline",
    "\\end{tabular}",
    "",
  ].join("\n");
}
