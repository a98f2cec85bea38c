import { describe, expect, it } from "vitest";
import { benchFigureKinds } from "@/lib/exports/figures/bench-figures";
import { skyFigureKinds } from "@/lib/exports/figures/sky-figures";
import { figureDataFormats, isFigureDataFormat } from "@/lib/exports/figure-data/formats";
import { figureDataKinds } from "@/lib/exports/figure-data/registry";
import { figureDataFile } from "@/lib/exports/figure-data/write";
import { deflectionData } from "@/lib/exports/figure-data/bench-data";
import { deflectionCurves } from "@/lib/bench/plot-data";
import { tableWriters } from "@/lib/exports/tables/formats";
import { provenance } from "./inputs";

describe("figure data registry and formats", () => {
  it("has a data builder for every exported figure kind", () => {
    expect(Object.keys(figureDataKinds).sort()).toEqual([...benchFigureKinds, ...skyFigureKinds].sort());
  });

  it("writes CSV, ECSV and VOTable with the table exports' media types and extensions", () => {
    const table = deflectionData({ curves: deflectionCurves(), provenance });
    expect(figureDataFormats).toEqual(["csv", "ecsv", "votable"]);
    for (const format of figureDataFormats) {
      const file = figureDataFile(table, format);
      expect(file.contentType).toBe(tableWriters[format].contentType);
      expect(file.extension).toBe(tableWriters[format].extension);
      expect(file.carriesProvenance).toBe(format !== "csv");
    }
    expect(figureDataFile(table, "csv").text.split("\r\n")[0]).toBe("Impact parameter b / M,\"Deflection α, exact [rad]\",\"Deflection α, weak field 1st order [rad]\",\"Deflection α, weak field 2nd order [rad]\",\"Deflection α, weak field 3rd order [rad]\",\"Deflection α, strong-deflection limit [rad]\"");
    expect(figureDataFile(table, "ecsv").text.startsWith("# %ECSV 1.0\n")).toBe(true);
    expect(figureDataFile(table, "votable").text).toContain('<TABLE name="deflection" nrows="240">');
    expect(isFigureDataFormat("ecsv")).toBe(true);
    expect(isFigureDataFormat("png")).toBe(false);
  });
});
