import { parse as parseYaml, YAMLError } from "yaml";
import { AppError } from "@/lib/errors";

const importError = (message: string) => new AppError("bad_request:import", message);

/** What an ECSV header says of one column: its unit and UCD (read by the column mapping). */
export interface EcsvColumnSpec {
  unit?: string;
  ucd?: string;
}

/** An ECSV file split into what its header says and the CSV body that follows it. */
export interface EcsvFile {
  /** The body's delimiter: "," or " " (ECSV 1.0 allows these two; space is the default). */
  delimiter: "," | " ";
  /** Column specs by column name. */
  columns: Map<string, EcsvColumnSpec>;
  /** The CSV text after the header: its first row names the columns. */
  body: string;
}

const ECSV_SIGNATURE = /^# %ECSV \d+\.\d+\s*$/;

type Node = Record<string, unknown>;
const isNode = (value: unknown): value is Node => typeof value === "object" && value !== null && !Array.isArray(value) && !(value instanceof Map);

/** A column's meta as astropy writes it (a map, or a YAML 1.1 !!omap that reads as a Map or a list of one-key maps). */
function metaUcd(meta: unknown): string | undefined {
  const entries = meta instanceof Map ? [...meta.entries()] : Array.isArray(meta) ? meta.filter(isNode).flatMap(Object.entries) : isNode(meta) ? Object.entries(meta) : [];
  const ucd = entries.find(([key]) => key === "ucd")?.[1];
  return typeof ucd === "string" ? ucd : undefined;
}

/**
 * Reads an ECSV file's header (Astropy's Enhanced CSV, APE6, ECSV 1.0): the first line is
 * "# %ECSV 1.0", the lines that follow starting with "#" are a YAML document whose `datatype` list
 * gives each column's name, unit and meta (its UCD), and whose `delimiter` the body's. Returns
 * undefined for text that is no ECSV; refuses a header that is not YAML with a message for the user.
 * YAML 1.1, the version astropy writes (its !!omap meta).
 */
export function readEcsvHeader(text: string): EcsvFile | undefined {
  const lines = text.split(/\r?\n/);
  if (!ECSV_SIGNATURE.test(lines[0] ?? "")) return undefined;
  const headerLength = lines.findIndex((line) => !line.startsWith("#"));
  const yamlText = lines
    .slice(1, headerLength < 0 ? lines.length : headerLength)
    .map((line) => line.replace(/^# ?/, ""))
    .join("\n");
  let header: unknown;
  try {
    // The yaml parser caps alias expansion (maxAliasCount), so a header cannot grow into a bomb.
    header = parseYaml(yamlText, { version: "1.1" });
  } catch (error) {
    if (!(error instanceof YAMLError)) throw error;
    throw importError("The ECSV header (the lines starting with #) is not valid YAML. Export the table again.");
  }
  const columns = new Map<string, EcsvColumnSpec>();
  const datatype = isNode(header) ? header.datatype : undefined;
  for (const spec of Array.isArray(datatype) ? datatype.filter(isNode) : []) {
    if (typeof spec.name !== "string") continue;
    const ucd = metaUcd(spec.meta);
    columns.set(spec.name, { ...(typeof spec.unit === "string" ? { unit: spec.unit } : {}), ...(ucd !== undefined ? { ucd } : {}) });
  }
  const delimiter = isNode(header) && header.delimiter === "," ? "," : " ";
  return { delimiter, columns, body: headerLength < 0 ? "" : lines.slice(headerLength).join("\n") };
}
