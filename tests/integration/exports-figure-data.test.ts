import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { astrometricTrackData, deflectionData, lensPlaneData, lightCurveData } from "@/lib/exports/figure-data/bench-data";
import { figureDataFormats } from "@/lib/exports/figure-data/formats";
import { nightData, nightSkyData, seasonData } from "@/lib/exports/figure-data/sky-data";
import { figureDataFile } from "@/lib/exports/figure-data/write";
import { headerOf, type DataTable } from "@/lib/exports/tables/data-table";
import { benchInputs, nightInput, nightSkyInput, provenance, seasonInput } from "../unit/figure-data/inputs";

/** The text a CSV cell holds after papaparse's formula guard (a leading apostrophe; OWASP CSV injection). */
const csvCell = (cell: DataTable["rows"][number][number]) => (typeof cell === "string" && /^[=+\-@\t\r]/.test(cell) ? `'${cell}` : cell);

/** Every figure's data table, built from the data its figure draws (as bench-figures.ts and sky-figures.ts compute it). */
function figureTables(): DataTable[] {
  const bench = benchInputs();
  const season = seasonInput();
  return [
    lensPlaneData({ layout: bench.results.lensPlane, unit: bench.lensPlaneUnit, provenance }),
    deflectionData({ curves: bench.curves, provenance }),
    lightCurveData({ lightCurve: bench.lightCurve, event: bench.event, provenance }),
    astrometricTrackData({ track: bench.track, thetaERad: bench.event.thetaERad, unit: bench.shiftUnit, event: bench.event, provenance }),
    nightData({ visibility: nightInput(), provenance }),
    nightSkyData({ sky: nightSkyInput(), provenance }),
    seasonData({ view: season.view, targetIndices: season.targetIndices, provenance }),
  ];
}

describe("figure data read by astropy and STILTS (tests/validators/check_figure_data.py)", () => {
  it("every figure's table in CSV, ECSV and VOTable reads back with every row, each value to 1e-9 relative, its unit, UCD and description", () => {
    const tables = figureTables();
    const directory = mkdtempSync(join(tmpdir(), "arcwright-figure-data-"));
    try {
      const expected = tables.map((table) => {
        const files: Record<string, string> = {};
        for (const format of figureDataFormats) {
          const file = figureDataFile(table, format);
          files[format] = `${table.name}.${file.extension}`;
          writeFileSync(join(directory, files[format]), file.text);
        }
        return {
          name: table.name,
          files,
          columns: table.columns.map((column) => ({ name: column.name, header: headerOf(column), unit: column.voUnit === "" ? null : column.voUnit, ucd: column.ucd, description: column.description })),
          rows: table.rows,
          csvRows: table.rows.map((row) => row.map(csvCell)),
          provenance: table.provenance,
        };
      });
      writeFileSync(join(directory, "expected.json"), JSON.stringify({ tables: expected }));
      const startedAt = Date.now();
      const run = spawnSync("/usr/bin/python3", ["tests/validators/check_figure_data.py", directory], { encoding: "utf8" });
      expect(run.error).toBeUndefined();
      const report = JSON.parse(run.stdout) as { problems: string[]; rows: number };
      console.info(`figure data validators: ${Date.now() - startedAt} ms for ${tables.length} tables, ${report.rows} rows, ${figureDataFormats.length} formats`);
      expect(report.problems).toEqual([]);
      expect(run.status).toBe(0);
      expect(report.rows).toBe(tables.reduce((sum, table) => sum + table.rows.length, 0));
    } finally {
      rmSync(directory, { recursive: true, force: true });
    }
    // Python with astropy and one STILTS JVM: ~5 s on an idle machine, several times that on a busy one.
  }, 90_000);
});
