import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { tableColumnsQuerySchema } from "@/lib/exports/tables/columns";
import { targetTableCsv } from "@/lib/exports/tables/csv";
import { DEC_SECOND_DECIMALS, RA_SECOND_DECIMALS, type TargetTable } from "@/lib/exports/tables/table";
import { formatDeclinationColons, formatRightAscensionColons } from "@/lib/workspace/coordinates";
import { exportProvenance, exportRows } from "./fixtures";

describe("sexagesimal RA and Dec for proposal forms", () => {
  it("write what astropy 5.2's Angle.to_string(sep=':', pad=True) writes for the Galactic Centre (checked by hand with it)", () => {
    expect(formatRightAscensionColons(266.4168, RA_SECOND_DECIMALS)).toBe("17:45:40.032");
    expect(formatDeclinationColons(-29.00782, DEC_SECOND_DECIMALS)).toBe("-29:00:28.15");
    expect(formatDeclinationColons(2.2, DEC_SECOND_DECIMALS)).toBe("+02:12:00.00");
  });

  it("round on the total seconds, so a value just below a carry keeps its 59.999 s and 24 h wraps to 0 h (by hand: 151.74999689299148° / 15 = 10 h 06 m 59.99925 s)", () => {
    expect(formatRightAscensionColons(151.74999689299148, RA_SECOND_DECIMALS)).toBe("10:06:59.999");
    expect(formatDeclinationColons(-89.98333141206919, DEC_SECOND_DECIMALS)).toBe("-89:58:59.99");
    expect(formatRightAscensionColons(359.99999999, RA_SECOND_DECIMALS)).toBe("00:00:00.000");
    // A negative declination that rounds to zero has no minus.
    expect(formatDeclinationColons(-1e-9, DEC_SECOND_DECIMALS)).toBe("+00:00:00.00");
  });

  it("sit beside the degrees in the CSV, a signed sexagesimal number unguarded while a formula after a sign still gets its apostrophe", () => {
    const columns = tableColumnsQuerySchema.parse({ columns: "name,decDeg,raDeg" });
    const rows = [exportRows[0], { ...exportRows[1], name: "-1:02:03=cmd" }];
    const table: TargetTable = { title: "Arcs", columns, rows, provenance: exportProvenance };
    const [header, first, second] = Papa.parse<string[]>(targetTableCsv(table), { skipEmptyLines: true }).data;
    expect(header).toEqual(["Name", "Dec (ICRS) [deg]", "Dec (ICRS) dms", "RA (ICRS) [deg]", "RA (ICRS) hms"]);
    expect(first).toEqual(["TB-ML-0001", "-29.201388889", "-29:12:05.00", "269.301666667", "17:57:12.400"]);
    expect(second).toEqual(["'-1:02:03=cmd", "2.2", "+02:12:00.00", "150.1", "10:00:24.000"]);
  });
});
