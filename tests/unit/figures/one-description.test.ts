import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { XMLParser, XMLValidator } from "fast-xml-parser";
import { describe, expect, it } from "vitest";
import { FigureSvg } from "@/components/figures/figure-svg";
import { orbitingStar } from "@/db/seed/demo-scenario";
import { angleInUnit, unitLabel } from "@/lib/bench/display-units";
import { figureMarkup } from "@/lib/exports/figures/figure-markup";
import { standaloneSvg } from "@/lib/exports/figures/svg-document";
import { astrometricTrackPlot } from "@/lib/figures/astrometric-track-plot";
import { deflectionPlot } from "@/lib/figures/deflection-plot";
import { eventFitPlot } from "@/lib/figures/event-fit-plot";
import { eventFitView } from "@/lib/figures/event-fit-view";
import type { FigureTree } from "@/lib/figures/figure-tree";
import { lensPlaneDiagram } from "@/lib/figures/lens-plane-diagram";
import { lightCurvePlot } from "@/lib/figures/light-curve-plot";
import { nightChart } from "@/lib/figures/night-chart";
import { nightSkyBrightnessChart } from "@/lib/figures/night-sky-brightness";
import { orbitSkyPlot } from "@/lib/figures/orbit-sky-plot";
import { orbitSkyView } from "@/lib/figures/orbit-sky-view";
import { printPalette } from "@/lib/figures/plot-palette";
import { scheduleTimelinePlot } from "@/lib/figures/schedule-timeline-plot";
import { seasonChart } from "@/lib/figures/season-chart";
import { fitPointLens, type PhotometryPoint } from "@/lib/lensing/fit";
import { relativisticOrbitOf } from "@/lib/lensing/relativistic-orbit";
import { pointLensMagnification } from "@/lib/physics/point-lens";
import { orbitInputsOf } from "@/lib/workspace/derived";
import { benchInputs, nightInput, nightSkyInput, provenance, seasonInput } from "../figure-data/inputs";

/** A noise-free point-lens event in one dataset (Paczyński 1986's A), fitted: the event-fit figure's input. */
function eventFitTree(): FigureTree {
  const points: PhotometryPoint[] = Array.from({ length: 80 }, (_, i) => {
    const tDays = 2_461_200 + i;
    const flux = 2 * pointLensMagnification(Math.hypot(0.2, (tDays - 2_461_240) / 15)) + 1;
    return { tDays, flux, fluxErr: 0.01 * flux, dataset: "Survey" };
  });
  const fit = fitPointLens(points);
  const view = eventFitView({ fit, points, referenceDataset: "Survey", prediction: null, schedule: { windows: [{ startJdUtc: 2_461_250, endJdUtc: 2_461_250.3 }], visitsJdUtc: Float64Array.of(2_461_250.1) } });
  return eventFitPlot({ view, title: "Light curve of TB-1", width: 760, height: 460 });
}

function orbitSkyTree(): FigureTree {
  const outcome = relativisticOrbitOf(orbitInputsOf({ ...orbitingStar, scienceCase: "relativistic-orbit" }, { dLensPc: 8300, dSourcePc: 9000, dLensSourcePc: 700, zLens: 0 }));
  if ("missing" in outcome) throw new Error(outcome.missing);
  return orbitSkyPlot({ view: orbitSkyView(outcome.orbit)!, title: "Orbit of S-test on the sky", size: 520 });
}

/** Every figure kind, drawn from the inputs the figure-data tests use (sites and targets invented). */
function figures(): [string, FigureTree][] {
  const bench = benchInputs();
  const size = { width: 540, height: 340 };
  const thetaERad = bench.results.lensPlane.thetaERad;
  const season = seasonInput();
  const night = nightInput();
  return [
    ["deflection", deflectionPlot({ curves: bench.curves, ...size })],
    ["lens plane", lensPlaneDiagram({ layout: bench.results.lensPlane, thetaEInUnit: angleInUnit(thetaERad, bench.lensPlaneUnit), unitLabel: unitLabel(bench.lensPlaneUnit), ...size })],
    ["light curve", lightCurvePlot({ lightCurve: bench.lightCurve, ...size })],
    ["astrometric track", astrometricTrackPlot({ track: bench.track, thetaEInUnit: angleInUnit(thetaERad, bench.shiftUnit), unitLabel: unitLabel(bench.shiftUnit), ...size })],
    ["event fit", eventFitTree()],
    ["night", nightChart({ visibility: night, plannedVisits: { visitsJdUtc: [night.samples.jdUtc[200]], visitLengthDays: 0.02 } })],
    ["night sky", nightSkyBrightnessChart({ sky: nightSkyInput() })],
    ["orbit on the sky", orbitSkyTree()],
    ["season", seasonChart({ view: season.view, targetIndices: season.targetIndices })],
    ["schedule timeline", scheduleTimelinePlot({ schedule: season.schedules[0], caseId: null, solution: null, event: null }).tree],
    ["deflection, print style", deflectionPlot({ curves: bench.curves, ...size, palette: printPalette })],
  ];
}

// Elements in order with their attributes and text, entities decoded: what a reader of the SVG sees.
const parser = new XMLParser({ preserveOrder: true, ignoreAttributes: false, attributeNamePrefix: "", parseAttributeValue: false, parseTagValue: false, trimValues: false, htmlEntities: true });
/** React separates adjacent text runs with an empty comment; the text read is the same without it. */
const withoutTextSeparators = (markup: string) => markup.replaceAll("<!-- -->", "");
const elementCount = (markup: string) => (markup.match(/<[a-zA-Z]/g) ?? []).length;

describe("one description, two drawings: each figure's tree drawn on screen and written by the exports", () => {
  for (const [kind, tree] of figures()) {
    it(`the ${kind} figure: the screen's SVG and the export's markup hold the same elements, attributes and text`, () => {
      const screen = renderToStaticMarkup(createElement(FigureSvg, { tree }));
      const exported = figureMarkup(tree);
      expect(XMLValidator.validate(exported)).toBe(true);
      expect(elementCount(exported)).toBeGreaterThan(20);
      expect(elementCount(screen)).toBe(elementCount(exported));
      expect(parser.parse(withoutTextSeparators(screen))).toEqual(parser.parse(exported));
    });
  }

  it("writes a standalone SVG file that parses as XML in the SVG namespace, with its text and accessible name", () => {
    for (const [kind, tree] of figures()) {
      const { svg } = standaloneSvg(figureMarkup(tree), { title: `Test ${kind}`, provenance });
      expect(XMLValidator.validate(svg), kind).toBe(true);
      const root = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "" }).parse(svg).svg;
      expect(root.xmlns).toBe("http://www.w3.org/2000/svg");
      expect(root.role).toBe("img");
      expect(root["aria-label"]).toBe(tree.properties.ariaLabel);
    }
  });
});
