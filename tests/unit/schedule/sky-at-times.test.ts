import { describe, expect, it } from "vitest";
import { buildNightGrid } from "@/lib/astro/night-grid";
import { nightMoon } from "@/lib/astro/night-moon";
import { refractionScale } from "@/lib/astro/refraction";
import { observingSchedule } from "@/lib/schedule";
import { parseScheduleConditions } from "@/lib/schedule/request";
import { skyAtTimes } from "@/lib/schedule/visit-sky";
import { bulge, southSite } from "./sites";

describe("the sky at arbitrary times of a night (skyAtTimes)", () => {
  const conditions = { site: southSite, target: bulge, cycleStartNightIso: "2022-06-20", cycleEndNightIso: "2022-06-20", limits: { airmassLimit: 2 }, cadenceHours: 1, visitMinutes: 20 };

  it("gives at a visit's middle exactly what the schedule's visit sky holds (one computation, no second copy)", () => {
    const schedule = observingSchedule(conditions);
    const count = schedule.visitsJdUtc.length;
    expect(count).toBeGreaterThan(5);
    const site = parseScheduleConditions(conditions).site;
    const grid = buildNightGrid(site, "2022-06-20", 5);
    const middles = schedule.visitsJdUtc.map((start) => start + schedule.visitLengthDays / 2);
    const sky = skyAtTimes(site, grid, nightMoon(grid, site), refractionScale(site.elevationM), bulge, middles)!;
    for (const key of ["airmass", "targetZenithDeg", "moonZenithDeg", "moonSeparationDeg", "moonPhaseAngleDeg"] as const) {
      expect(Array.from(sky[key])).toEqual(Array.from(schedule.visitSky[key]));
    }
  });

  it("is null on a night without astronomical darkness", () => {
    const site = { name: "Far north (invented)", latitudeDeg: 65, longitudeEastDeg: 20, elevationM: 100, horizonLimitDeg: 0 };
    const grid = buildNightGrid(site, "2022-06-21", 5);
    expect(skyAtTimes(site, grid, nightMoon(grid, site), refractionScale(site.elevationM), bulge, new Float64Array([grid.startJdUtc + 0.5]))).toBeNull();
  });
});
