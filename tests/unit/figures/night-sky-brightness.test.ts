import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { XMLValidator } from "fast-xml-parser";
import { describe, expect, it } from "vitest";
import { FigureSvg } from "@/components/figures/figure-svg";
import { TargetNightPanel } from "@/components/sky/target-night-panel";
import { nightSkyBrightnessChart } from "@/lib/figures/night-sky-brightness";
import { nightSkyBrightness } from "@/lib/photometry/night-sky";
import { bandSkyOf, defaultPhotometrySettings } from "@/lib/workspace/photometry-schema";
import { bulge, southSite } from "../schedule/sites";

const found = bandSkyOf(defaultPhotometrySettings, "jc-i");
if (!("sky" in found)) throw new Error(found.missing);
const render = (sky: ReturnType<typeof nightSkyBrightness>) => renderToStaticMarkup(createElement(FigureSvg, { tree: nightSkyBrightnessChart({ sky }) }));

describe("the sky brightness figure (night-sky-brightness.tsx)", () => {
  it("names target, site, band and night in its title, labels the inverted axis and its legend, and marks the Moon rising", () => {
    // Last quarter: the Moon rises in the small hours of 21 June 2022 UTC.
    const sky = nightSkyBrightness({ site: southSite, target: bulge, nightDateIso: "2022-06-20", bandSky: found.sky });
    const svg = render(sky);
    expect(XMLValidator.validate(svg)).toBe(true);
    expect(svg).toContain(`Sky at Bulge field from Southern ridge (invented) in ${found.sky.band.label}, night of 2022-06-20`);
    expect(svg).toContain("sky brightness (mag/arcsec²)");
    for (const legend of ["sky with the Moon", "dark sky (no Moon)", "Moon&#x27;s added light (hatched)", "Moon rises or sets"]) expect(svg).toContain(legend);
    expect(svg).toMatch(/Moon rises <!-- -->0[45]:\d\d|Moon rises 0[45]:\d\d/);
    // Brighter up: the tick labels grow downwards (smaller magnitudes nearer the top).
    const ticks = [...svg.matchAll(/<text x="\d+(?:\.\d+)?" y="(\d+(?:\.\d+)?)" text-anchor="end">(\d+(?:\.\d+)?)<\/text>/g)].map(([, y, mag]) => ({ y: Number(y), mag: Number(mag) }));
    expect(ticks.length).toBeGreaterThan(2);
    const sorted = [...ticks].sort((a, b) => a.y - b.y);
    for (let i = 1; i < sorted.length; i++) expect(sorted[i].mag).toBeGreaterThan(sorted[i - 1].mag);
    expect(svg).toContain("the Moon brightens it by up to");
  });

  it("says why it draws nothing on a night without darkness", () => {
    const sky = nightSkyBrightness({ site: { name: "Far north (invented)", latitudeDeg: 65, longitudeEastDeg: 20, elevationM: 100 }, target: { name: "Field", raDeg: 270, decDeg: 40 }, nightDateIso: "2022-06-21", bandSky: found.sky });
    const svg = render(sky);
    expect(svg).toContain("No astronomical darkness this night");
    expect(svg).not.toContain("dark sky (no Moon)");
  });
});

describe("the target night panel's sky brightness", () => {
  const panel = (bandSky: Parameters<typeof TargetNightPanel>[0]["bandSky"]) =>
    renderToStaticMarkup(
      createElement(TargetNightPanel, { site: southSite, target: bulge, airmassLimit: 2, initialNightIso: "2022-06-20", schedule: null, bandSky, figureExport: { proposalId: "p", targetId: "t" } }),
    );

  it("draws the figure for the panel's night with its download buttons", () => {
    const html = panel(found);
    expect(html).toContain('data-testid="night-sky-brightness" data-night="2022-06-20"');
    expect(html).toContain("Download the sky brightness figure as PNG");
  });

  it("says why there is no figure when the band is not described", () => {
    const html = panel({ missing: "Set the site's dark sky and extinction in Hα narrow in the photometry settings." });
    expect(html).toContain("No sky brightness figure: Set the site&#x27;s dark sky and extinction in Hα narrow in the photometry settings.");
    expect(html).not.toContain("night-sky-brightness");
  });
});
