import Papa from "papaparse";
import { Document, isMap, isSeq } from "yaml";
import { dataCellOf, descriptionOf, type ChosenColumn } from "./columns";
import { quoteCommentLike } from "./csv";
import type { TargetTable } from "./table";

/** ECSV's name for each column kind (ECSV 1.0 allowed datatypes, APE6 as revised 2021). */
const ecsvDatatypes = { double: "float64", int: "int64", text: "string" } as const;

function columnSpecOf({ column }: ChosenColumn) {
  return {
    name: column.key,
    // VOUnit strings (solMass, mas/yr, uarcsec) parse as astropy units; θ_E, which is none, is in the description.
    ...(column.voUnit !== "" ? { unit: column.voUnit } : {}),
    datatype: ecsvDatatypes[column.kind],
    description: descriptionOf(column),
    meta: { ucd: column.ucd },
  };
}

/**
 * The YAML header: `datatype` (one line per column), the comma delimiter and the provenance as
 * `meta`. Written as YAML 1.1, the version astropy's and STILTS's loaders read, so a text such as
 * "no" or an ISO time is quoted and comes back as the same text, not a boolean or a date.
 */
function headerOf(table: TargetTable): string {
  const header = new Document({ datatype: table.columns.map(columnSpecOf), delimiter: ",", meta: table.provenance }, { version: "1.1" });
  const columns = header.get("datatype");
  if (isSeq(columns)) for (const item of columns.items) if (isMap(item)) item.flow = true;
  return header.toString({ lineWidth: 0 });
}

/**
 * The table as ECSV 1.0 (Astropy's Enhanced Character Separated Values, APE6): a `# `-prefixed YAML
 * header giving each column's name, unit, datatype, description and UCD and the export's provenance,
 * then the table as comma-separated values, header row first (written by papaparse). astropy and
 * STILTS read it with its units and provenance; any CSV reader reads its body. Cells are written as
 * the data formats write them (`dataCellOf`), text exactly as stored: unlike the plain CSV, no
 * apostrophe guards a formula-like name, since the file is for table tools and must read back the
 * same. An empty field is a value the model does not give.
 */
export function targetTableEcsv(table: TargetTable): string {
  const yamlLines = headerOf(table).trimEnd().split("\n");
  const body = Papa.unparse(
    {
      fields: table.columns.map(({ column }) => column.key),
      data: table.rows.map((row) => table.columns.map((chosen) => dataCellOf(row, chosen))),
    },
    { newline: "\n", quotes: quoteCommentLike },
  );
  return ["# %ECSV 1.0", "# ---", ...yamlLines.map((line) => `# ${line}`), body, ""].join("\n");
}
