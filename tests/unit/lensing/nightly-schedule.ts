/**
 * A hand-made ObservingSchedule for the science-case tests (the schedule is built by lib/schedule;
 * here only its contract type is used).
 */
import type { EmptyScheduleReason, ObservingSchedule, ScheduleGap, ScheduleGapReason, TimeSpanJd } from "@/lib/schedule/types";

/** 2027-03-01 00:00 UTC. */
export const CYCLE_START_JD = 2_461_465.5;

export interface NightlyScheduleOptions {
  nights: number;
  /** First and last night (index from the cycle's start) on which the target is observable. */
  seasonFirstNight: number;
  seasonLastNight: number;
  /** Usable window each night, as fractions of the UTC day. */
  windowStartDay?: number;
  windowEndDay?: number;
  cadenceHours?: number;
  emptyReason?: EmptyScheduleReason | null;
}

/**
 * A schedule as lib/schedule shapes one: on each night of the season one usable window (default
 * 01:00–07:00 UTC) holding visits at the cadence; daylight between windows; outside the season the
 * target behind the Sun.
 */
export function nightlySchedule(options: NightlyScheduleOptions): ObservingSchedule {
  const { nights, seasonFirstNight, seasonLastNight, windowStartDay = 1 / 24, windowEndDay = 7 / 24, cadenceHours = 24, emptyReason = null } = options;
  const windows: TimeSpanJd[] = [];
  const gaps: ScheduleGap[] = [];
  const visits: number[] = [];
  const cycle = { startJdUtc: CYCLE_START_JD, endJdUtc: CYCLE_START_JD + nights };
  const gap = (startJdUtc: number, endJdUtc: number, reason: ScheduleGapReason) => {
    if (endJdUtc > startJdUtc) gaps.push({ startJdUtc, endJdUtc, reason });
  };
  let cursor = cycle.startJdUtc;
  if (emptyReason === null) {
    for (let night = seasonFirstNight; night <= seasonLastNight; night++) {
      const start = CYCLE_START_JD + night + windowStartDay;
      const end = CYCLE_START_JD + night + windowEndDay;
      gap(cursor, start, night === seasonFirstNight ? "sun" : "daylight");
      windows.push({ startJdUtc: start, endJdUtc: end });
      for (let t = start; t <= end - 20 / 1440; t += cadenceHours / 24) visits.push(t);
      cursor = end;
    }
  }
  gap(cursor, cycle.endJdUtc, emptyReason === null ? "sun" : "below-limit");
  const season =
    emptyReason === null
      ? [
          {
            startJdUtc: windows[0]!.startJdUtc,
            endJdUtc: windows[windows.length - 1]!.endJdUtc,
            nightCount: seasonLastNight - seasonFirstNight + 1,
            usableNightCount: seasonLastNight - seasonFirstNight + 1,
            firstNightIso: "",
            lastNightIso: "",
            lengthDays: windows[windows.length - 1]!.endJdUtc - windows[0]!.startJdUtc,
          },
        ]
      : [];
  const schedule = {
    cycle,
    firstNightIso: "2027-02-28",
    nightCount: nights,
    windows,
    gaps,
    visitsJdUtc: Float64Array.from(visits),
    visitLengthDays: 20 / 1440,
    visitSky: {
      airmass: new Float32Array(visits.length).fill(1),
      targetZenithDeg: new Float32Array(visits.length),
      moonZenithDeg: new Float32Array(visits.length).fill(180),
      moonSeparationDeg: new Float32Array(visits.length).fill(180),
      moonPhaseAngleDeg: new Float32Array(visits.length).fill(180),
    },
    seasons: season,
    usableHoursPerNight: new Float32Array(nights),
    weeklyUsableHours: new Float32Array(Math.ceil(nights / 7)),
    bestWeekIndices: [],
    emptyReason,
  };
  return schedule;
}
