import { describe, expect, it } from "vitest";
import { columnFromHeader, parseCsvTable } from "@/lib/imports/csv";
import { MAX_IMPORT_ROWS } from "@/lib/imports/limits";
import { slowdown } from "../../support/timing";
import { refusal } from "./refusal";

describe("parseCsvTable", () => {
  it("reads the header as columns and numbers data rows from 1 (RFC 4180 §2.3: optional header line)", () => {
    const table = parseCsvTable("name,ra,dec\nA,10.5,-3\nB,11,4\n");
    expect(table.columns.map((column) => column.name)).toEqual(["name", "ra", "dec"]);
    expect(table.rows).toEqual([
      { rowNumber: 1, cells: ["A", "10.5", "-3"] },
      { rowNumber: 2, cells: ["B", "11", "4"] },
    ]);
  });

  it("keeps quoted commas, doubled quotes and line breaks inside a field (RFC 4180 §2.6–2.7)", () => {
    const table = parseCsvTable('name,note\r\n"Arc, north","said ""bright""\r\nnext line"\r\n');
    expect(table.rows[0].cells).toEqual(["Arc, north", 'said "bright"\r\nnext line']);
  });

  it("detects semicolon and tab delimiters as spreadsheets in many locales write them (common practice)", () => {
    expect(parseCsvTable("name;ra\nA;1,5\n").rows[0].cells).toEqual(["A", "1,5"]);
    expect(parseCsvTable("name\tra\nA\t1.5\n").rows[0].cells).toEqual(["A", "1.5"]);
  });

  it("reads a unit in brackets or parentheses after a header (common practice)", () => {
    const table = parseCsvTable("mass [Msun],D_L (kpc),,name\n1,2,3,x\n");
    expect(table.columns).toEqual([{ name: "mass", unit: "Msun" }, { name: "D_L", unit: "kpc" }, { name: "column 3" }, { name: "name" }]);
  });

  it("keeps cell text verbatim, formula-like text included (neutralized only on export)", () => {
    const table = parseCsvTable('name,tags\n=HYPERLINK("http://x"),@sum\n');
    expect(table.rows[0].cells).toEqual(['=HYPERLINK("http://x")', "@sum"]);
  });

  it("leaves a row with the wrong number of fields to row validation", () => {
    expect(parseCsvTable("a,b,c\n1,2\n").rows[0].cells).toEqual(["1", "2"]);
  });

  it("refuses an unclosed quoted field as malformed, naming the row (RFC 4180 §2.5)", () => {
    const error = refusal(() => parseCsvTable('name,ra\nA,1\n"B,2\nC,3\n'));
    expect(error.code).toBe("bad_request:import");
    expect(error.message).toBe("The CSV is malformed. Row 2: a quoted field is never closed (RFC 4180 §2.5–2.7).");
  });

  it("refuses text after a closing quote (RFC 4180 §2.7)", () => {
    expect(refusal(() => parseCsvTable('name,ra\n"A"x,1\n')).message).toMatch(/^The CSV is malformed\. Row 1: /);
  });

  it("refuses a file with only a header row, and a blank file", () => {
    expect(refusal(() => parseCsvTable("name,ra,dec\n")).message).toBe("The file has a header row but no data rows.");
    expect(refusal(() => parseCsvTable("\n\n")).message).toBe("The file is empty.");
  });

  it(`accepts ${MAX_IMPORT_ROWS} data rows and refuses one more`, () => {
    const body = (rows: number) => `name\n${"x\n".repeat(rows)}`;
    expect(parseCsvTable(body(MAX_IMPORT_ROWS)).rows).toHaveLength(MAX_IMPORT_ROWS);
    expect(refusal(() => parseCsvTable(body(MAX_IMPORT_ROWS + 1))).message).toBe("The file has more than 10,000 data rows; split it into smaller lists.");
  });
});

describe("columnFromHeader", () => {
  it("takes the unit from the last bracket pair, with brackets inside the unit kept", () => {
    expect(columnFromHeader("  D_L   ( kpc )  ", 0)).toEqual({ name: "D_L", unit: "kpc" });
    expect(columnFromHeader("flux (a) [mJy]", 0)).toEqual({ name: "flux (a)", unit: "mJy" });
    expect(columnFromHeader("a (b (c)", 0)).toEqual({ name: "a", unit: "b (c" });
    expect(columnFromHeader("[kpc]", 0)).toEqual({ name: "[kpc]" });
    expect(columnFromHeader("note ( )", 0)).toEqual({ name: "note ( )" });
  });

  it("refuses a header longer than 200 characters, naming the column", () => {
    expect(refusal(() => columnFromHeader(`name ${"x".repeat(200)}`, 2)).message).toBe(
      "The header of column 3 is longer than 200 characters; shorten it to the column's name.",
    );
  });

  it("answers a 600-character header of spaces around a bracket as fast as a normal one (regression: polynomial backtracking, 2 s)", async () => {
    const hostile = `a${" ".repeat(300)}[${" ".repeat(298)}x`;
    const readOrRefuse = () => expect(refusal(() => columnFromHeader(hostile, 0)).code).toBe("bad_request:import");
    // A refusal builds an error with its stack, some microseconds; the old pattern took 10^6 times as long as a normal header.
    expect(await slowdown(readOrRefuse, () => columnFromHeader("mass [Msun]", 0), { normalCalls: 100 })).toBeLessThan(1000);
    const withinLimit = `a${" ".repeat(100)}[${" ".repeat(96)}x`;
    expect(await slowdown(() => columnFromHeader(withinLimit, 0), () => columnFromHeader("mass [Msun]", 0), { hostileCalls: 100, normalCalls: 100 })).toBeLessThan(50);
  });
});
