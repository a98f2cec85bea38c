import { cellOf, dataCellOf, descriptionOf, isWrittenAsStored, type ChosenColumn } from "./columns";
import type { TargetTable } from "./table";
import { escapeXml } from "./xml";

/** VOTable 1.4 keeps the 1.3 namespace (IVOA VOTable 1.4 Recommendation, 2019-10-21, §1). */
export const VOTABLE_NAMESPACE = "http://www.ivoa.net/xml/VOTable/v1.3";

const isAscii = (text: string) => /^[\x20-\x7E]*$/.test(text);

function fieldOf(chosen: ChosenColumn, rows: TargetTable["rows"]): string {
  const { column } = chosen;
  const attributes: [string, string][] = [["name", column.key]];
  if (column.kind === "double") {
    attributes.push(["datatype", "double"]);
    // A bare number (or F) would be decimal places (VOTable 1.4 §4.2): a reader rewriting the file,
    // astropy among them, then prints 1.752e-11 d as 0.0000. E<n> is significant figures; a value
    // written as stored has no precision to declare.
    if (!isWrittenAsStored(chosen)) attributes.push(["precision", `E${chosen.digits}`]);
  } else if (column.kind === "int") attributes.push(["datatype", "int"]);
  else {
    // "char" is for ASCII; a column holding other characters is declared unicodeChar (VOTable 1.4 §2.1).
    const isAllAscii = rows.every((row) => isAscii(String(cellOf(row, column) ?? "")));
    attributes.push(["datatype", isAllAscii ? "char" : "unicodeChar"], ["arraysize", "*"]);
  }
  if (column.voUnit !== "") attributes.push(["unit", column.voUnit]);
  attributes.push(["ucd", column.ucd]);
  if (column.key === "raDeg" || column.key === "decDeg") attributes.push(["ref", "icrs"]);
  const attributeText = attributes.map(([k, v]) => `${k}="${escapeXml(v)}"`).join(" ");
  return `      <FIELD ${attributeText}>\n        <DESCRIPTION>${escapeXml(descriptionOf(column))}</DESCRIPTION>\n      </FIELD>`;
}

const info = (name: string, value: string, body?: string) =>
  `    <INFO name="${escapeXml(name)}" value="${escapeXml(value)}"${body === undefined ? "/>" : `>${escapeXml(body)}</INFO>`}`;

/**
 * The table as an IVOA VOTable 1.4 document (TABLEDATA serialization): one FIELD per column with its
 * datatype, VOUnit and UCD; ICRS positions through a COOSYS; the provenance as INFO elements of the
 * RESOURCE. A double the model does not give is an empty TD (NaN, VOTable 1.4 §6); inputs are written
 * as stored unless the request names their digits (`isWrittenAsStored`), and `precision="E<n>"` states the
 * significant digits of a rounded column.
 */
export function targetTableVotable(table: TargetTable): string {
  const p = table.provenance;
  const infos = [
    info("product", `${p.product} ${p.version}`),
    info("exportedAt", p.exportedAt),
    info("reproduceUrl", p.reproduceUrl),
    ...Object.entries(p.inputs).map(([key, value]) => info(`input.${key}`, value === null ? "" : String(value))),
    info("cosmology", `${p.cosmology.model} H0=${p.cosmology.H0KmPerSPerMpc} km/s/Mpc Om0=${p.cosmology.Om0}`, p.cosmology.source),
    ...p.constants.map((c) => info(`constant.${c.name.replace(/\s+/g, "_")}`, `${c.value} ${c.unit}`, c.source)),
  ];
  const rows = table.rows.map(
    (row) => `          <TR>${table.columns.map((chosen) => `<TD>${escapeXml(String(dataCellOf(row, chosen) ?? ""))}</TD>`).join("")}</TR>`,
  );
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<VOTABLE version="1.4" xmlns="${VOTABLE_NAMESPACE}" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance" xsi:schemaLocation="${VOTABLE_NAMESPACE} http://www.ivoa.net/xml/VOTable/votable-1.4.xsd">`,
    '  <COOSYS ID="icrs" system="ICRS"/>',
    '  <RESOURCE type="results">',
    `    <DESCRIPTION>${escapeXml(p.subject)}</DESCRIPTION>`,
    ...infos,
    `    <TABLE name="targets" nrows="${table.rows.length}">`,
    `      <DESCRIPTION>${escapeXml(`Targets of ${table.title}`)}</DESCRIPTION>`,
    ...table.columns.map((chosen) => fieldOf(chosen, table.rows)),
    "      <DATA>",
    "        <TABLEDATA>",
    ...rows,
    "        </TABLEDATA>",
    "      </DATA>",
    "    </TABLE>",
    "  </RESOURCE>",
    "</VOTABLE>",
    "",
  ].join("\n");
}
