import { parseCsvTable } from "@/lib/imports/csv";
import { decodeImportText, looksLikeXml, type ImportTable } from "@/lib/imports/import-table";
import { parseVoTable } from "@/lib/imports/votable";

/**
 * Reads an uploaded target list by its content, not its name: XML is read as a VOTable, anything
 * else as CSV. Throws an AppError (`bad_request:import`, `payload_too_large:import`) with a message
 * for the user for any file that cannot be read.
 */
export function readImportFile(bytes: Uint8Array): ImportTable {
  const text = decodeImportText(bytes);
  return looksLikeXml(text) ? parseVoTable(text) : parseCsvTable(text);
}
