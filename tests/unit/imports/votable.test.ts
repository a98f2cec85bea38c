import { describe, expect, it } from "vitest";
import { MAX_IMPORT_ROWS } from "@/lib/imports/limits";
import type { AppError } from "@/lib/errors";
import { MAX_VOTABLE_DEPTH, parseVoTable } from "@/lib/imports/votable";
import { refusal } from "./refusal";

const FIELDS = `
  <FIELD name="name" datatype="char" arraysize="*" ucd="meta.id;meta.main"/>
  <FIELD name="RAJ2000" datatype="double" unit="deg" ucd="pos.eq.ra;meta.main"/>
  <FIELD name="sigma" datatype="float" unit="km.s-1" ucd="phys.veloc.dispersion"><VALUES null="-999"/></FIELD>`;

function votable(rows: string, fields = FIELDS): string {
  return `<?xml version="1.0" encoding="UTF-8"?>
<VOTABLE version="1.4" xmlns="http://www.ivoa.net/xml/VOTable/v1.3">
 <RESOURCE type="results">
  <TABLE name="candidates">${fields}
   <DATA><TABLEDATA>${rows}</TABLEDATA></DATA>
  </TABLE>
 </RESOURCE>
</VOTABLE>`;
}

describe("parseVoTable", () => {
  it("reads FIELDs with unit and ucd as columns and TR/TD as rows (IVOA VOTable 1.4 §4, §5.2)", () => {
    const table = parseVoTable(votable("<TR><TD>Lantern Arc</TD><TD>63.0396</TD><TD>245</TD></TR><TR><TD>Vesper</TD><TD>199.61</TD><TD>210</TD></TR>"));
    expect(table.format).toBe("votable");
    expect(table.columns).toEqual([
      { name: "name", ucd: "meta.id;meta.main" },
      { name: "RAJ2000", unit: "deg", ucd: "pos.eq.ra;meta.main" },
      { name: "sigma", unit: "km.s-1", ucd: "phys.veloc.dispersion" },
    ]);
    expect(table.rows).toEqual([
      { rowNumber: 1, cells: ["Lantern Arc", "63.0396", "245"] },
      { rowNumber: 2, cells: ["Vesper", "199.61", "210"] },
    ]);
  });

  it("reads a cell equal to the FIELD's VALUES null as empty, and an empty TD as empty (VOTable 1.4 §4.5)", () => {
    const table = parseVoTable(votable("<TR><TD>A</TD><TD/><TD>-999</TD></TR>"));
    expect(table.rows[0].cells).toEqual(["A", "", ""]);
  });

  it("decodes the predefined entities and character references (XML 1.0 §4.6, §4.1)", () => {
    const table = parseVoTable(votable("<TR><TD>Q&amp;A &#x3b1;&#946; &lt;1&gt;</TD><TD>1</TD><TD>2</TD></TR>"));
    expect(table.rows[0].cells[0]).toBe("Q&A αβ <1>");
  });

  it("reads a namespace-prefixed document and a TABLE in a nested RESOURCE (VOTable 1.4 §3.1)", () => {
    const text = `<vot:VOTABLE xmlns:vot="http://www.ivoa.net/xml/VOTable/v1.3"><vot:RESOURCE><vot:RESOURCE><vot:TABLE>
      <vot:FIELD name="name"/><vot:DATA><vot:TABLEDATA><vot:TR><vot:TD>A</vot:TD></vot:TR></vot:TABLEDATA></vot:DATA>
    </vot:TABLE></vot:RESOURCE></vot:RESOURCE></vot:VOTABLE>`;
    expect(parseVoTable(text).rows[0].cells).toEqual(["A"]);
  });

  it("refuses the billion-laughs entity bomb before parsing, without expanding anything", () => {
    const bomb = `<?xml version="1.0"?>
<!DOCTYPE VOTABLE [
 <!ENTITY lol "lol">
 <!ENTITY lol2 "&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;&lol;">
 <!ENTITY lol3 "&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;&lol2;">
 <!ENTITY lol9 "&lol3;&lol3;&lol3;&lol3;&lol3;&lol3;&lol3;&lol3;&lol3;&lol3;">
]>${votable("<TR><TD>&lol9;</TD><TD>1</TD><TD>2</TD></TR>").replace(/^<\?xml[^>]*>/, "")}`;
    const started = performance.now();
    const error = refusal(() => parseVoTable(bomb));
    expect(error.code).toBe("bad_request:import");
    expect(error.message).toMatch(/declares a DOCTYPE or entities/);
    expect(performance.now() - started).toBeLessThan(100);
  });

  it("refuses an external entity that would read a local file", () => {
    const external = `<?xml version="1.0"?><!DOCTYPE VOTABLE [<!ENTITY secret SYSTEM "file:///etc/passwd">]>
<VOTABLE><RESOURCE><TABLE><FIELD name="name"/><DATA><TABLEDATA><TR><TD>&secret;</TD></TR></TABLEDATA></DATA></TABLE></RESOURCE></VOTABLE>`;
    expect(refusal(() => parseVoTable(external)).message).toMatch(/declares a DOCTYPE or entities/);
  });

  it("leaves an undeclared entity reference as written instead of expanding it", () => {
    expect(parseVoTable(votable("<TR><TD>&nbsp;x</TD><TD>1</TD><TD>2</TD></TR>")).rows[0].cells[0]).toBe("&nbsp;x");
  });

  it("refuses malformed XML with its line and column", () => {
    const error = refusal(() => parseVoTable("<VOTABLE>\n<RESOURCE><TABLE></RESOURCE>\n</VOTABLE>"));
    expect(error.message).toMatch(/^The XML is malformed at line 2, column \d+: /);
  });

  it("refuses XML that is not a VOTable, a VOTable without a table, and one with two tables", () => {
    expect(refusal(() => parseVoTable("<catalog><item/></catalog>")).message).toBe("The XML file is not a VOTable (its root element is not VOTABLE).");
    expect(refusal(() => parseVoTable("<VOTABLE><RESOURCE/></VOTABLE>")).message).toBe("The VOTable holds no TABLE.");
    const two = "<VOTABLE><RESOURCE><TABLE><FIELD name='a'/></TABLE><TABLE><FIELD name='b'/></TABLE></RESOURCE></VOTABLE>";
    expect(refusal(() => parseVoTable(two)).message).toBe("The VOTable holds 2 tables; import one table per file.");
  });

  it("refuses FITS data inside a VOTable, naming the serializations it reads (VOTable 1.4 §5.3)", () => {
    const fits = `<VOTABLE><RESOURCE><TABLE><FIELD name="a" datatype="int"/><DATA><FITS extnum="1"><STREAM href="table.fits"/></FITS></DATA></TABLE></RESOURCE></VOTABLE>`;
    expect(refusal(() => parseVoTable(fits)).message).toBe("The VOTable's data are in FITS serialization; export it with TABLEDATA, BINARY or BINARY2.");
  });

  it("refuses a table with FIELDs but no rows (headers only)", () => {
    expect(refusal(() => parseVoTable(votable(""))).message).toBe("The VOTable has its columns but no data rows.");
  });

  it("refuses deeply nested elements with a clear import error, as fast as a table of the same size (a regression: the parser's own error escaped and the upload hung)", () => {
    const nested = (depth: number) => `<VOTABLE>${"<RESOURCE>".repeat(depth)}${"</RESOURCE>".repeat(depth)}</VOTABLE>`;
    // Nested to the bound it is still read (and has no table); one level more is refused.
    expect(refusal(() => parseVoTable(nested(MAX_VOTABLE_DEPTH - 1))).message).toBe("The VOTable holds no TABLE.");
    expect(refusal(() => parseVoTable(nested(MAX_VOTABLE_DEPTH))).message).toBe(
      `The XML nests its elements more than ${MAX_VOTABLE_DEPTH} levels deep, far more than a VOTable needs; it is refused. Export the table again.`,
    );
    // 100,000 levels (2 MB, under the 5 MB list limit) against a flat table of as many bytes.
    const deep = nested(100_000);
    const flat = votable("<TR><TD>A</TD><TD>1</TD><TD>2</TD></TR>".repeat(Math.ceil(deep.length / 40))).slice(0, deep.length);
    const time = (run: () => void) => {
      const started = performance.now();
      run();
      return performance.now() - started;
    };
    let deepError: AppError | undefined;
    const deepMs = time(() => (deepError = refusal(() => parseVoTable(deep))));
    const flatMs = time(() => refusal(() => parseVoTable(flat)));
    expect(deepError?.code).toBe("bad_request:import");
    expect(deepMs / flatMs).toBeLessThan(5);
  });

  it(`refuses more than ${MAX_IMPORT_ROWS} rows`, () => {
    const rows = "<TR><TD>A</TD><TD>1</TD><TD>2</TD></TR>".repeat(MAX_IMPORT_ROWS + 1);
    expect(refusal(() => parseVoTable(votable(rows))).message).toBe("The file has more than 10,000 data rows; split it into smaller lists.");
  });
});
