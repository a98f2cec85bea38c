import { describe, expect, it } from "vitest";
import { proposePhotometryMapping } from "@/lib/event-photometry/mapping";
import type { ImportColumn, ImportRow } from "@/lib/imports/import-table";
import { parseCsvTable } from "@/lib/imports/csv";

/** Mapping proposals from headers as survey and follow-up files write them (common practice; our selection of spellings). */
const propose = (csv: string) => {
  const table = parseCsvTable(csv);
  return proposePhotometryMapping(table.columns, table.rows);
};

describe("proposed photometry mapping", () => {
  it("reads the offset from an “HJD - 2450000” header and the scale from “HJD_UTC”", () => {
    expect(propose("HJD_UTC - 2450000,mag,magerr\n11200.5,18.1,0.01\n").mapping).toMatchObject({ timeKind: "HJD", timeOffsetDays: 2_450_000, timeScale: "UTC", brightnessKind: "magnitude", valueColumn: 1, errorColumn: 2 });
    expect(propose("BJD-2460000 (TDB),flux,flux_err\n1200.5,5,1\n").mapping).toMatchObject({ timeKind: "BJD", timeOffsetDays: 2_460_000, timeScale: "TDB", brightnessKind: "flux" });
    expect(propose("hmjd,mag,e_mag\n61200.5,18,0.02\n").mapping).toMatchObject({ timeKind: "HJD", timeOffsetDays: 2_400_000.5, errorColumn: 2 });
  });

  it("takes the offset from values around 1e4 when the header gives none, and says so", () => {
    const { mapping, notes } = propose("HJD,I,sigma\n11200.5,18.1,0.01\n11201.5,18.0,0.01\n");
    expect(mapping).toMatchObject({ timeKind: "HJD", timeOffsetDays: 2_450_000, band: "I" });
    expect(notes).toContain("The times in “HJD” are around 11,201.5: read as days after JD 2450000 (2013–2031). Check the offset.");
  });

  it("asks for the offset when values of ~3,000 could be after 2450000 or 2460000", () => {
    const { mapping, notes } = propose("JD,mag,err\n3200.5,18,0.01\n");
    expect(mapping.timeOffsetDays).toBeUndefined();
    expect(notes).toContain("The times in “JD” are around 3,200.5: say which offset they are counted from (2400000, 2450000 or 2460000).");
  });

  it("never guesses the time scale", () => {
    const { mapping, notes } = propose("time,mag,mag_err\n2461200.5,18,0.01\n");
    expect(mapping.timeScale).toBeUndefined();
    expect(mapping).toMatchObject({ timeColumn: 0, timeKind: "JD", timeOffsetDays: 0 });
    expect(notes).toContain("The file does not say which time scale the times are in: say whether they are UTC, TT or TDB.");
  });

  it("reads a VOTable's UCDs: time.epoch in days, phot.mag, stat.error;phot.mag; band and telescope columns", () => {
    const columns: ImportColumn[] = [
      { name: "obs", ucd: "time.epoch", unit: "d" },
      { name: "m", ucd: "phot.mag", unit: "mag" },
      { name: "s", ucd: "stat.error;phot.mag", unit: "mag" },
      { name: "filter" },
      { name: "telescope" },
    ];
    const rows: ImportRow[] = [{ rowNumber: 1, cells: ["2461200.5", "18", "0.01", "I", "A"] }];
    expect(proposePhotometryMapping(columns, rows).mapping).toEqual({ timeColumn: 0, timeKind: "JD", timeOffsetDays: 0, brightnessKind: "magnitude", valueColumn: 1, errorColumn: 2, bandColumn: 3, datasetColumn: 4 });
  });

  it("names what it could not find", () => {
    expect(propose("a,b\n1,2\n").notes).toEqual(["No column looks like the time: choose the time column.", "No column looks like a magnitude or a flux: choose the brightness column."]);
  });
});
