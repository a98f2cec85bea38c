import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { XMLValidator } from "fast-xml-parser";
import { describe, expect, it } from "vitest";
import { ScheduleTimeline } from "@/components/targets/schedule-timeline";
import { demoPhotometry, demoSourcePhotometry } from "@/db/seed/demo-photon-budget";
import { demoProposal, demoTargets } from "@/db/seed/demo-scenario";
import { demoCycle, demoInterferometer } from "@/db/seed/demo-sky-cycle";
import { parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";
import { eventTimingOf, lensSolutionOf, targetCaseReport, targetSchedules, type FeasibilitySettings } from "@/lib/workspace/derived";
import { photometrySettingsSchema } from "@/lib/workspace/photometry-schema";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";

/** The demo proposal as the seed stores it, and its faint dwarf in a bright blend (S/N 13 where 50 is asked at its worst visit). */
const settings: FeasibilitySettings = {
  site: demoProposal.site,
  instrument: instrumentSchema.parse({ ...demoProposal.instrument, ...demoInterferometer }),
  photometry: photometrySettingsSchema.parse(demoPhotometry),
  ...demoCycle,
};
const demo = demoTargets.find((t) => t.name === "Cinder Bunting")!;
const row = { ...demo, ...demoSourcePhotometry[demo.name], raDeg: parseRightAscensionDeg(demo.ra), decDeg: parseDeclinationDeg(demo.dec) };
const schedule = targetSchedules(settings, [row])[0];
const solved = lensSolutionOf(row)!;
const report = targetCaseReport(row, settings, schedule, solved)!;
const budget = "budget" in report.photonBudget ? report.photonBudget.budget : null;
const timeline = (photonBudget: typeof budget) =>
  renderToStaticMarkup(createElement(ScheduleTimeline, { schedule, caseId: report.scienceCase.caseId, solution: report.solution, event: eventTimingOf(row, solved.solution, solved.geometry), photonBudget }));

describe("the schedule timeline's S/N track", () => {
  it("draws each needed visit's S/N against the labelled goal, the short visits as triangles, the worst visit boxed, with a legend that names each shape", () => {
    expect(budget).not.toBeNull();
    const html = timeline(budget);
    const svg = /<svg[\s\S]*?<\/svg>/.exec(html)![0];
    expect(XMLValidator.validate(svg)).toBe(true);
    expect(html).toContain('data-testid="schedule-snr-track"');
    expect(html).toMatch(/data-testid="schedule-snr-goal">S\/N goal (<!-- -->)?50</);
    // The worst visit's S/N, as the depth answer states it (13.x).
    expect(html).toMatch(/worst: S\/N 13\.\d/);
    expect((html.match(/data-testid="schedule-snr-worst"/g) ?? []).length).toBe(1);
    const shortMarks = (html.match(/data-below-goal="true"/g) ?? []).length;
    expect(shortMarks).toBeGreaterThan(0);
    expect(budget!.shortVisits).toBeGreaterThan(0);
    // Every visit falls short here, so the legend names the triangles and not the circles.
    expect(budget!.shortVisits).toBe(budget!.visitsJdUtc.length);
    for (const legend of ["visit S/N, below the goal", "S/N goal 50", "worst visit"]) expect(html).toContain(legend);
    expect(html).not.toContain("visit S/N, goal reached");
    expect(html).toMatch(/falls? short of it \(drawn as triangles\)/);
  });

  it("has no track without a photon budget", () => {
    const html = timeline(null);
    expect(html).not.toContain("schedule-snr-track");
    expect(html).not.toContain("visit S/N, below the goal");
  });
});
