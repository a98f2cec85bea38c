import { execFile, spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import { afterAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { demoTargets } from "@/db/seed/demo-scenario";
import { demoCycle } from "@/db/seed/demo-sky-cycle";
import { targetTableExportRoutes } from "@/lib/server/api/export-routes";
import { exportColumnKeys, tableColumnsQuerySchema } from "@/lib/exports/tables/columns";
import { targetTableLatex } from "@/lib/exports/tables/latex";
import { updateProposal } from "@/lib/server/proposals";
import { createTarget } from "@/lib/server/targets";
import { exportProvenance, exportRows } from "../unit/exports/fixtures";
import { createWorld } from "./support/world";

const run = promisify(execFile);

afterAll(async () => {
  await dbClient().sql.end();
});

/** A name as copied from a paper: a true minus sign (U+2212) and Ω, which stopped pdflatex. */
const PAPER_NAME = "HE 0435\u22121223 \u03a9";

/** Target names with every kind of character the LaTeX mapping handles, all of which the kernel's OT1 encoding sets. */
const unicodeNames = ["HE 0435\u22121223", "\u03a9 Cen \u03b1\u03b2\u03b3 \u03b4", "\u015arī Mahāvīra", "A&B 5% x_1 #2 a^b ~c \\d {e}", "Lens 🔭 arc", "[OII] --arc"];
/** Letters that only the T1 encoding has (stated in the file's preamble comment); no capital Đ, whose T1 glyph is Ð's. */
const t1OnlyNames = ["Świątek Þórr ðđŋ"];

/** The world: the demo scenario's targets on the demo cycle, plus the name copied from a paper. */
async function demoLikeProposal(): Promise<{ download: (query: string) => Promise<string> }> {
  const world = await createWorld();
  await updateProposal({ proposalId: world.proposalId }, { ...demoCycle, photometry: { apertureM: 2, bandId: "jc-i" } }, world.actors.pi);
  const paperTarget = { ...demoTargets[0], name: PAPER_NAME, ra: "04 38 14.9", dec: "-12 17 14" };
  for (const { notes: _notes, status: _status, ...target } of [...demoTargets, paperTarget]) {
    await createTarget({ proposalId: world.proposalId }, target, world.actors.pi);
  }
  const routes = targetTableExportRoutes(async () => world.actors.viewer);
  return {
    download: async (query) => {
      const response = await routes.GET(new Request(`http://arcwright.test/api/proposals/${world.proposalId}/exports/targets?${query}`), { params: Promise.resolve({ proposalId: world.proposalId }) });
      expect(response.status, query).toBe(200);
      return response.text();
    },
  };
}

/** The \usepackage lines the file's "% Preamble:" comment states, so the test compiles what a reader is told to write. */
function statedPreamble(tex: string): string {
  const comment = tex.split("\n").find((line) => line.startsWith("% Preamble:"));
  expect(comment).toBeDefined();
  return [...comment!.matchAll(/\\usepackage(\[[^\]]*\])?\{[^}]*\}/g)].map((match) => match[0]).join("\n");
}

interface Compiled {
  log: string;
  text: string;
}

/** One pdflatex run (nonstop, halting at the first error) and the PDF's text by pdftotext. */
async function compile(directory: string, name: string, preamble: string, table: string): Promise<Compiled> {
  writeFileSync(join(directory, `${name}.tex`), `\\documentclass{article}\n${preamble}\n\\begin{document}\n${table}\n\\end{document}\n`);
  try {
    await run("pdflatex", ["-interaction=nonstopmode", "-halt-on-error", `${name}.tex`], { cwd: directory });
  } catch (error) {
    const log = readFileSync(join(directory, `${name}.log`), "utf8");
    throw new Error(`pdflatex failed on ${name}: ${log.split("\n").filter((line) => line.startsWith("!")).join(" ") || String(error)}`);
  }
  const { stdout } = await run("pdftotext", ["-layout", `${name}.pdf`, "-"], { cwd: directory });
  // NFC: some fonts name their Ω glyph the ohm sign (U+2126), canonically the same letter.
  return { log: readFileSync(join(directory, `${name}.log`), "utf8"), text: stdout.normalize("NFC") };
}

describe("LaTeX table export compiled by pdflatex (Debian's texlive) and read back by pdftotext (poppler-utils)", () => {
  it("compiles the default export, Unicode names and every column in each fit, with no overfull box and the names intact", async () => {
    for (const tool of ["pdflatex", "pdftotext"]) {
      expect(spawnSync(tool, ["-v"]).error, `${tool} is missing: npm test installs texlive-latex-base, texlive-latex-recommended, lmodern and poppler-utils`).toBeUndefined();
    }
    const proposal = await demoLikeProposal();
    const allColumns = `columns=${exportColumnKeys.join(",")}`;
    const [defaultExport, allShrink, allSplit, allLandscape] = await Promise.all(
      ["format=tex", `format=tex&${allColumns}`, `format=tex&${allColumns}&fit=split`, `format=tex&${allColumns}&fit=landscape`].map(proposal.download),
    );
    const defaultColumns = tableColumnsQuerySchema.parse({});
    const namesTable = (names: string[]) =>
      targetTableLatex({ title: "Arcs ∝ Ω", columns: defaultColumns, rows: names.map((name, i) => ({ ...exportRows[i % exportRows.length], name })), provenance: exportProvenance });
    const unicodeTable = namesTable([...unicodeNames, ...t1OnlyNames]);
    const preamble = statedPreamble(defaultExport);
    const documents: [string, string, string][] = [
      ["default", preamble, defaultExport],
      ["unicode", preamble, unicodeTable],
      // The kernel's default encoding (OT1) sets every name but the T1-only letters.
      ["unicode-ot1", "\\usepackage{graphicx}", namesTable(unicodeNames)],
      ["all-shrink", preamble, allShrink],
      ["all-split", preamble, allSplit],
      ["all-landscape", statedPreamble(allLandscape), allLandscape],
    ];
    const directory = mkdtempSync(join(tmpdir(), "arcwright-latex-"));
    try {
      const startedAt = Date.now();
      const compiled = await Promise.all(documents.map(([name, documentPreamble, table]) => compile(directory, name, documentPreamble, table)));
      console.info(`pdflatex and pdftotext: ${Date.now() - startedAt} ms for ${documents.length} documents`);
      const byName = Object.fromEntries(documents.map(([name], i) => [name, compiled[i]]));
      for (const [name, { log }] of Object.entries(byName)) {
        // Any warning but the first run's note that labels are new (a second run would settle them).
        expect(log.match(/^(Overfull \\hbox.*|LaTeX Warning: (?!Label\(s\) may have changed).*|Missing character.*)$/gm) ?? [], name).toEqual([]);
      }

      // The stated preamble: T1 with outline fonts, graphicx for \resizebox, rotating for sidewaystable.
      expect(preamble).toBe("\\usepackage[T1]{fontenc}\n\\usepackage{lmodern}\n\\usepackage{graphicx}");
      expect(statedPreamble(allLandscape)).toBe(`${preamble}\n\\usepackage{rotating}`);

      // A true minus in the name and in negative declinations (U+2212 in the PDF's text, not a hyphen).
      const defaultText = byName.default.text;
      expect(defaultText).toContain(PAPER_NAME);
      expect(defaultText).toMatch(/\u221212\.28\d+/);
      expect(defaultText).not.toMatch(/ -\d/);
      expect(defaultText).toContain("Table 1: Targets of the proposal");

      // LaTeX builds ī from a dotless i and a macron (no T1 glyph has both), which pdftotext gives as ı + U+0304.
      const unicodeText = byName.unicode.text.replaceAll("ı\u0304", "ī");
      for (const name of [...unicodeNames.filter((name) => !name.includes("🔭")), ...t1OnlyNames]) expect(unicodeText, name).toContain(name);
      // An emoji has no glyph in any TeX font: the file names its code point.
      expect(unicodeText).toContain("Lens [U+1F52D] arc");
      expect(unicodeText).toContain("Table 1: Targets of the proposal “Arcs ∝ Ω”.");

      // Every column: split in parts that each carry the names, or one table shrunk or turned.
      const parts = [...allSplit.matchAll(/\\begin\{table\}/g)].length;
      expect(parts).toBeGreaterThan(2);
      expect(byName["all-split"].text.split(PAPER_NAME).length - 1).toBe(parts);
      // A caption may wrap over lines in the PDF's text.
      expect(byName["all-split"].text.replace(/\s+/g, " ")).toContain(`Part ${parts} of ${parts}.`);
      expect(byName["all-landscape"].text).toContain(PAPER_NAME);
      expect(byName["all-shrink"].text).toContain(PAPER_NAME);
    } finally {
      rmSync(directory, { recursive: true, force: true });
    }
  });
});
