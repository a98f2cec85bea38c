import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { XMLValidator } from "fast-xml-parser";
import { describe, expect, it } from "vitest";
import { benchPlotExport } from "@/lib/exports/figures/bench-figures";
import { nightPlotExport, scheduleSeasonPlotExport } from "@/lib/exports/figures/sky-figures";
import { sketchFromSearchParams } from "@/lib/bench/sketch-state";
import { deflectionCurves } from "@/lib/bench/plot-data";
import { FigureSvg } from "@/components/figures/figure-svg";
import { deflectionPlot } from "@/lib/figures/deflection-plot";
import { plotPalette, printPalette } from "@/lib/figures/plot-palette";
import { scriptParts } from "@/lib/figures/plot-text";
import { axisTicks } from "@/lib/figures/plot-ticks";
import { scaleLog } from "d3";
import { wrapName } from "@/lib/figures/season-chart";
import { bulge, bulgeSeason, southSite } from "../schedule/sites";

const origin = "https://arcwright.test";
const bench = (kind: Parameters<typeof benchPlotExport>[0]) => benchPlotExport(kind, sketchFromSearchParams({}), origin).markup;
const skyContext = { site: { ...southSite, horizonLimitDeg: 0 }, limits: { airmassLimit: 2 }, appOrigin: origin, inputs: {} };

/** The text of every <text> element, its tspans joined: what a reader sees. */
const texts = (svg: string) => [...svg.matchAll(/<text\b[^>]*>(.*?)<\/text>/g)].map(([, inner]) => inner.replace(/<[^>]+>/g, ""));
/** Tick labels: the texts of the frame's tick marks (middle-anchored under x, end-anchored left of y). */
const tickTexts = (svg: string) => [...svg.matchAll(/<text x="[\d.]+" y="[\d.]+" text-anchor="(?:middle|end)">(.*?)<\/text>/g)].map(([, inner]) => inner.replace(/<[^>]+>/g, ""));
/** The ground: the first rect, full size, of the root <svg>. */
const groundFill = (svg: string) => /^<svg\b[^>]*><rect width="\d+" height="\d+" fill="([^"]+)"/.exec(svg)?.[1];

describe("publication style of exported figures (issue 18, item 5)", () => {
  it("every export is drawn on a white ground with dark ink; the screen keeps the night style", () => {
    const night = nightPlotExport({ ...bulge, name: "Bulge field" }, "2022-06-20", skyContext).markup;
    for (const svg of [bench("deflection"), bench("lens-plane"), bench("light-curve"), bench("astrometric-track"), night]) {
      expect(XMLValidator.validate(svg)).toBe(true);
      expect(groundFill(svg)).toBe("#ffffff");
      // Neither the dark ground nor the screen's pale ink anywhere in the file.
      expect(svg).not.toContain(plotPalette.ground);
      expect(svg).not.toContain(plotPalette.ink);
    }
    expect(printPalette.text).toBe("#1a1a1a");
    const screen = renderToStaticMarkup(createElement(FigureSvg, { tree: deflectionPlot({ curves: deflectionCurves(), width: 540, height: 340 }) }));
    expect(groundFill(screen)).toBe("#0b0f17");
  });

  it("writes subscripts as shifted tspans, not underscores: θ_E, t_E, t_0, b_c", () => {
    const svgs = [bench("deflection"), bench("lens-plane"), bench("light-curve"), bench("astrometric-track")].join("");
    expect(texts(svgs).join(" ")).not.toMatch(/[θtb]_[Ec0]/);
    // Lens plane legend: θ then E lowered by 0.28 em at 72 % of 11 px.
    expect(svgs).toContain('>Einstein ring θ<tspan dy="3.1" font-size="7.9">E</tspan></text>');
    expect(svgs).toContain('>b<tspan dy="3.1" font-size="7.9">c</tspan><tspan dy="-3.1"> = 3√3 M</tspan></text>');
    expect(svgs).toContain('>centroid track, t<tspan dy="3.1" font-size="7.9">0</tspan><tspan dy="-3.1"> ± 6 t</tspan><tspan dy="3.1" font-size="7.9">E</tspan></text>');
    expect(scriptParts("10^{−3} rad")).toEqual([
      { text: "10", shift: 0 },
      { text: "−3", shift: -0.38 },
      { text: " rad", shift: 0 },
    ]);
  });

  it("draws the number formatter's powers of ten as raised scripts (the bundled faces have no superscript glyphs)", () => {
    expect(scriptParts("4.1 × 10⁻¹² M☉")).toEqual([
      { text: "4.1 × 10", shift: 0 },
      { text: "−12", shift: -0.38 },
      { text: " M☉", shift: 0 },
    ]);
    // A log axis under two decades labels its ticks with the number formatter: 3 × 10⁻⁷ … at that scale.
    const labels = axisTicks(scaleLog().domain([2e-7, 9e-7]), 5).map((tick) => tick.label);
    expect(labels).toContain("3 × 10⁻⁷");
    expect(scriptParts("3 × 10⁻⁷").map((part) => part.shift)).toEqual([0, -0.38]);
    // ¹²³ are in the bundled faces: a unit's square stays the glyph it is.
    expect(scriptParts("mag/arcsec²")).toEqual([{ text: "mag/arcsec²", shift: 0 }]);
  });

  it("deflection ticks carry no SI prefix (d3 wrote 0.01 rad as '10m'): decades are powers of ten with a true minus", () => {
    const svg = bench("deflection");
    const ticks = tickTexts(svg);
    expect(ticks.length).toBeGreaterThan(6);
    for (const tick of ticks) expect(tick).not.toMatch(/\d\s*[yzafpnµumkMGTPEZY]$/);
    // 10⁻³ … 10¹ on the α axis, 10¹ … 10⁴ on b/M (exponents as raised tspans, read here run together).
    expect(ticks).toEqual(["101", "102", "103", "104", "10−3", "10−2", "10−1", "100", "101"]);
    expect(svg).toMatch(/>10<tspan dy="-4\.2" font-size="7\.9">−2<\/tspan>/);
    expect(texts(svg)).toContain("deflection α (rad)");
  });

  it("negative tick labels use the minus sign U+2212, never a hyphen", () => {
    for (const svg of [bench("lens-plane"), bench("astrometric-track")]) {
      const ticks = tickTexts(svg);
      expect(ticks.some((tick) => tick.startsWith("−"))).toBe(true);
      expect(ticks.filter((tick) => /^-/.test(tick))).toEqual([]);
    }
  });

  it("the night figure names its target and site in its title", () => {
    const svg = nightPlotExport({ ...bulge, name: "Śrī Ωmega−1" }, "2022-06-20", skyContext).markup;
    expect(texts(svg)).toContain("Śrī Ωmega−1 from Southern ridge (invented), night of 2022-06-20");
  });

  it("the season axis carries the year, long names are wrapped whole, and an empty row is a drawn cross (no font has ✕)", () => {
    const longName = "OGLE-2031-BLG-0001 a very long target name of the kind catalogues give, kept whole on the page";
    const conditions = { ...bulgeSeason, cycleStartNightIso: "2031-12-01", cycleEndNightIso: "2032-01-29", site: southSite };
    const targets = [{ ...bulge, name: longName }, { name: "North pole", raDeg: 0, decDeg: 89 }];
    const svg = scheduleSeasonPlotExport(targets, conditions, { ...skyContext, reproducePath: "/proposals/p/sky" }).markup;
    expect(XMLValidator.validate(svg)).toBe(true);
    const ticks = tickTexts(svg);
    expect(ticks[0]).toBe("2031-12-01");
    expect(ticks.some((tick) => tick.startsWith("2032-01"))).toBe(true);
    expect(texts(svg)).toContain("night (evening date, 2031–2032)");
    // The whole name, every word, in the row's lines.
    const nameLines = [...svg.matchAll(/<tspan x="[\d.]+"(?: dy="12")?>([^<]*)<\/tspan>/g)].map(([, line]) => line);
    expect(nameLines.length).toBeGreaterThan(1);
    expect(nameLines.join(" ")).toContain(longName);
    expect(wrapName(longName, 40).join(" ")).toBe(longName);
    expect(wrapName(longName, 40).every((line) => line.length <= 40)).toBe(true);
    // The pole never rises from 30° S: its row is empty and marked by a path, not a glyph.
    expect(svg).not.toContain("✕");
    expect(svg).toMatch(/<path d="M[\d.]+,[\d.]+ L[\d.]+,[\d.]+ M[\d.]+,[\d.]+ L[\d.]+,[\d.]+" stroke="#D55E00"/);
  });
});
