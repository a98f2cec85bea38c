/**
 * An edit of an sfnt (TrueType/OpenType) font for resvg replacing one table: the new table is
 * appended and the table directory entry points to it; other tables stay where they are (OpenType
 * specification 1.9, "Font file": table directory).
 */

/**
 * Renames the family by a new `name` table (format 0): Windows platform, Unicode BMP, US English
 * records for the family (1), subfamily (2), full name (4), PostScript name (6) and typographic
 * family (16).
 */
export function withFamilyName(sfnt: Uint8Array, family: string, subfamily: string): Uint8Array {
  const names: [number, string][] = [
    [1, family],
    [2, subfamily],
    [4, `${family} ${subfamily}`],
    [6, `${family}-${subfamily}`.replace(/[^A-Za-z0-9-]/g, "")],
    [16, family],
  ];
  const strings = names.map(([, text]) => Buffer.from(text, "utf16le").swap16());
  const headerBytes = 6 + 12 * names.length;
  const table = Buffer.alloc(headerBytes + strings.reduce((sum, s) => sum + s.length, 0));
  table.writeUInt16BE(0, 0);
  table.writeUInt16BE(names.length, 2);
  table.writeUInt16BE(headerBytes, 4);
  let stringOffset = 0;
  names.forEach(([nameId], index) => {
    const at = 6 + index * 12;
    table.writeUInt16BE(3, at);
    table.writeUInt16BE(1, at + 2);
    table.writeUInt16BE(0x0409, at + 4);
    table.writeUInt16BE(nameId, at + 6);
    table.writeUInt16BE(strings[index].length, at + 8);
    table.writeUInt16BE(stringOffset, at + 10);
    strings[index].copy(table, headerBytes + stringOffset);
    stringOffset += strings[index].length;
  });
  return withTable(sfnt, "name", table);
}

function withTable(sfnt: Uint8Array, tag: string, table: Buffer): Uint8Array {
  const source = Buffer.from(sfnt);
  const tableCount = source.readUInt16BE(4);
  const recordAt = Array.from({ length: tableCount }, (_, index) => 12 + index * 16).find((at) => source.toString("latin1", at, at + 4) === tag);
  if (recordAt === undefined) throw new Error(`The font has no ${tag} table.`);
  const tableAt = Math.ceil(source.length / 4) * 4;
  const result = Buffer.alloc(tableAt + Math.ceil(table.length / 4) * 4);
  source.copy(result);
  table.copy(result, tableAt);
  result.writeUInt32BE(checksum(result.subarray(tableAt, result.length)), recordAt + 4);
  result.writeUInt32BE(tableAt, recordAt + 8);
  result.writeUInt32BE(table.length, recordAt + 12);
  return result;
}

/** The sum of a table's big-endian 32-bit words, modulo 2³² (the table is padded to 4 bytes). */
function checksum(padded: Buffer): number {
  let sum = 0;
  for (let at = 0; at < padded.length; at += 4) sum = (sum + padded.readUInt32BE(at)) >>> 0;
  return sum;
}
