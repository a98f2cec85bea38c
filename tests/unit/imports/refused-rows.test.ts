import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { parseCsvTable } from "@/lib/imports/csv";
import { REFUSED_REASONS_HEADER, REFUSED_ROW_NUMBER_HEADER, refusedRowsCsv, refusedRowsFileName } from "@/lib/imports/refused-rows";

const columns = [{ name: "name" }, { name: "ra" }, { name: "dec" }, { name: "D_L", unit: "kpc" }];

describe("refused rows as CSV", () => {
  it("writes the row number, every cell under the file's headers with units, and the reasons, header first with CRLF (RFC 4180)", () => {
    // papaparse quotes a field its guard escaped.
    const csv = refusedRowsCsv(columns, [{ rowNumber: 4, cells: ["IMP-4", "18:02:00", "+95:00:00", "4"], errors: ["row 4: Dec +95:00:00 — Declination is from −90° to +90°."] }]);
    expect(csv).toBe(
      `${REFUSED_ROW_NUMBER_HEADER},name,ra,dec,D_L [kpc],${REFUSED_REASONS_HEADER}\r\n` +
        `4,IMP-4,18:02:00,"'+95:00:00",4,row 4: Dec +95:00:00 — Declination is from −90° to +90°.\r\n`,
    );
  });

  it("guards formula-like text with an apostrophe (OWASP CSV injection) but leaves plain numbers such as -12.5 as written", () => {
    const csv = refusedRowsCsv(columns, [{ rowNumber: 2, cells: ["=HYPERLINK(\"http://x\")", "@SUM(A1)", "-12.5", "+3"], errors: ["row 2: RA @SUM(A1) cannot be read."] }]);
    const [, row] = Papa.parse<string[]>(csv, { skipEmptyLines: true }).data;
    expect(row).toEqual(["2", "'=HYPERLINK(\"http://x\")", "'@SUM(A1)", "-12.5", "+3", "row 2: RA @SUM(A1) cannot be read."]);
  });

  it("keeps commas, quotes, line breaks and a missing cell, and reads back through the importer's own CSV reader with the units", () => {
    const csv = refusedRowsCsv(columns, [
      { rowNumber: 7, cells: ['Name, with "quotes"', "17 57 12", "-29 12 05"], errors: ["row 7: has 3 fields, but the header has 4.", "second\nline"] },
      { rowNumber: 9, cells: ["#hash", "1", "2", "3"], errors: ["row 9: x"] },
    ]);
    const table = parseCsvTable(csv);
    expect(table.columns.map((c) => [c.name, c.unit])).toEqual([
      [REFUSED_ROW_NUMBER_HEADER, undefined],
      ["name", undefined],
      ["ra", undefined],
      ["dec", undefined],
      ["D_L", "kpc"],
      [REFUSED_REASONS_HEADER, undefined],
    ]);
    expect(table.rows[0].cells).toEqual(["7", 'Name, with "quotes"', "17 57 12", "'-29 12 05", "", "row 7: has 3 fields, but the header has 4. second\nline"]);
    // A text starting with # is quoted, so astropy's reader does not take the row for a comment.
    expect(csv).toContain('\r\n9,"#hash",1,2,3,');
  });

  it("names the download after the uploaded file", () => {
    expect(refusedRowsFileName("bulge list.csv")).toBe("bulge list refused rows.csv");
    expect(refusedRowsFileName("cat.vot")).toBe("cat refused rows.csv");
    expect(refusedRowsFileName("plain")).toBe("plain refused rows.csv");
  });
});
