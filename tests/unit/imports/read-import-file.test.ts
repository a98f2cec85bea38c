import { describe, expect, it } from "vitest";
import { MAX_IMPORT_BYTES } from "@/lib/imports/limits";
import { readImportFile } from "@/lib/imports/read-import-file";
import { refusal } from "./refusal";

const bytesOf = (text: string) => new TextEncoder().encode(text);

describe("readImportFile", () => {
  it("reads CSV by content, dropping a UTF-8 byte-order mark (Unicode §23.8) before the first header", () => {
    const table = readImportFile(new Uint8Array([0xef, 0xbb, 0xbf, ...bytesOf("name,ra\nA,1\n")]));
    expect(table.format).toBe("csv");
    expect(table.columns[0].name).toBe("name");
  });

  it("reads XML by content as a VOTable", () => {
    const xml = '<VOTABLE><RESOURCE><TABLE><FIELD name="name"/><DATA><TABLEDATA><TR><TD>A</TD></TR></TABLEDATA></DATA></TABLE></RESOURCE></VOTABLE>';
    expect(readImportFile(bytesOf(`  ${xml}`)).format).toBe("votable");
  });

  it("refuses a file over 5 MB before reading it, with the 413 kind", () => {
    const error = refusal(() => readImportFile(new Uint8Array(MAX_IMPORT_BYTES + 1).fill(0x61)));
    expect(error.code).toBe("payload_too_large:import");
    expect(error.message).toBe("The file is larger than 5 MB, the limit for a target list.");
  });

  it("accepts a file of exactly 5 MB", () => {
    const text = `name\n${"x".repeat(MAX_IMPORT_BYTES - 6)}\n`;
    expect(bytesOf(text).length).toBe(MAX_IMPORT_BYTES);
    expect(readImportFile(bytesOf(text)).rows).toHaveLength(1);
  });

  it("refuses bytes that are not UTF-8 (a Latin-1 export, a binary file)", () => {
    expect(refusal(() => readImportFile(new Uint8Array([0x6e, 0x61, 0x6d, 0x65, 0x0a, 0xe9, 0x0a]))).message).toBe(
      "The file is not UTF-8 text. Save it as CSV (UTF-8) or as a VOTable.",
    );
  });

  it("refuses an empty file and a file of white space", () => {
    expect(refusal(() => readImportFile(new Uint8Array())).message).toBe("The file is empty.");
    expect(refusal(() => readImportFile(bytesOf(" \r\n\t"))).message).toBe("The file is empty.");
  });
});
