/**
 * The simulated observing schedule: for each target, the usable windows of every night of the
 * cycle, the visits a cadence places in them, the gaps with their reasons, the seasons and the best
 * weeks. The nights are built once and shared by every target, so many targets cost little more
 * than one.
 */
import { altitudeLimit } from "@/lib/astro/limits";
import { bestWeekIndices, weeklySums } from "@/lib/astro/season";
import { upperCulminationAltitudeDeg } from "@/lib/astro/target-night";
import { nightStartJdUtc } from "@/lib/astro/time";
import type { SkyTarget } from "@/lib/astro/inputs";
import { classifyScratch, classifyTargetNight, type ScheduleRules } from "./classify";
import { emptyScheduleReason } from "./empty-reason";
import { buildScheduleNight } from "./night";
import { parseScheduleConditions, parseScheduleTarget, parseScheduleTargets, type ScheduleRequest, type ScheduleSettings, type SchedulesRequest } from "./request";
import { observingSeasons } from "./seasons";
import { TargetTimeline } from "./timeline";
import type { ObservingSchedule } from "./types";
import { VisitSkyNights } from "./visit-sky";
import { placeVisits } from "./visits";

const DEG = Math.PI / 180;

/**
 * The schedule of `request.target` (ICRS degrees) at `request.site` over the nights
 * `cycleStartNightIso`…`cycleEndNightIso` (evening dates, inclusive). Usable time: astronomical
 * darkness (Sun ≤ −18°), the target above the airmass and horizon limits, not closer to the Sun than
 * the safe elongation (nightly rule), the Moon at least the minimum separation away and, with a
 * largest illumination, no brighter Moon above the horizon; nights lost to the clear-night fraction
 * (`isClearNight`) have none. Visits: `placeVisits`; seasons: `observingSeasons`; best weeks: the
 * season view's rule (`bestWeekIndices`) on this target's own hours; the sky at each visit:
 * `VisitSkyNights.skyOf` (`visit-sky.ts`).
 * Methods: the shared night grid (`lib/astro/night-grid.ts`), the Moon of `lib/astro/night-moon.ts`.
 * Accuracy: window edges to about a minute (tests: 1 minute against astropy).
 * Cost: about 0.2 ms per night (the Moon's ~0.05 ms included) plus about 3 µs per target-night and
 * under 1 µs per visit for its sky (`npm run bench -- schedule`).
 * Throws `AppError("bad_request:sky")` naming the invalid field.
 */
export function observingSchedule(request: ScheduleRequest): ObservingSchedule {
  const settings = parseScheduleConditions(request);
  return planSchedules(settings, [parseScheduleTarget(request.target)])[0];
}

/**
 * The schedules of every target of `request.targets` (1 to 5000) under the same conditions, in the
 * same order; each equal to what `observingSchedule` gives for that target alone.
 */
export function observingSchedules(request: SchedulesRequest): ObservingSchedule[] {
  const settings = parseScheduleConditions(request);
  return planSchedules(settings, parseScheduleTargets(request.targets));
}

function planSchedules(settings: ScheduleSettings, targets: readonly SkyTarget[]): ObservingSchedule[] {
  const limit = altitudeLimit(settings.site, settings.limits);
  const rules: ScheduleRules = {
    sinAltitudeLimit: limit.sinGeometric,
    cosSafeSunElongation: Math.cos(settings.limits.safeSunElongationDeg * DEG),
    cosMinMoonSeparation: settings.moonMinSeparationDeg ? Math.cos(settings.moonMinSeparationDeg * DEG) : null,
  };
  const startJdUtc = nightStartJdUtc(settings.firstNightIso, settings.site.longitudeEastDeg);
  const cycle = { startJdUtc, endJdUtc: startJdUtc + settings.nightCount };
  const timelines = targets.map(() => new TargetTimeline(settings.nightCount));
  const skyNights = new VisitSkyNights(settings.site, startJdUtc, settings.nightCount, limit.refractionScale);
  const scratch = classifyScratch();
  for (let index = 0; index < settings.nightCount; index++) {
    const night = buildScheduleNight(settings, index);
    for (let t = 0; t < targets.length; t++) classifyTargetNight(night, rules, targets[t], scratch, timelines[t]);
    skyNights.add(night);
  }

  return targets.map((target, t) => {
    const timeline = timelines[t];
    timeline.finish(cycle.endJdUtc);
    const visitsJdUtc = placeVisits(timeline.windows, settings.cadenceDays, settings.visitDays);
    const weeklyUsableHours = weeklySums(timeline.usableHoursPerNight);
    const isNeverUp = upperCulminationAltitudeDeg(settings.site.latitudeDeg, target.decDeg) < limit.geometricDeg;
    return {
      cycle,
      firstNightIso: settings.firstNightIso,
      nightCount: settings.nightCount,
      windows: timeline.windows,
      gaps: timeline.gaps,
      visitsJdUtc,
      visitLengthDays: settings.visitDays,
      visitSky: skyNights.skyOf(target, visitsJdUtc, settings.visitDays),
      seasons: observingSeasons(timeline, settings.visitDays, settings.firstNightIso),
      usableHoursPerNight: timeline.usableHoursPerNight,
      weeklyUsableHours,
      bestWeekIndices: bestWeekIndices(weeklyUsableHours),
      emptyReason: visitsJdUtc.length > 0 ? null : emptyScheduleReason(isNeverUp, timeline, settings.visitDays),
    };
  });
}
