/**
 * A target's simulated observing schedule as calendar events: one per usable window (on a clear
 * night) and one per planned visit, with the air mass the schedule judged them by and each visit's
 * exposure from the photon budget. Times come from the schedule itself (lib/schedule), the same one the
 * target page shows, rounded to the whole second a calendar holds.
 */
import { SUN_POINTING_CAUTION } from "@/lib/astro/sun-caution";
import { airmassPickering } from "@/lib/astro/airmass";
import { altitudeAzimuth } from "@/lib/astro/horizontal";
import type { SkySiteInput, SkyTarget } from "@/lib/astro/inputs";
import { addDaysIso, dateFromJdUtc } from "@/lib/astro/time";
import type { TargetPhotonBudget } from "@/lib/lensing/photon-budget";
import type { ObservingSchedule, TimeSpanJd } from "@/lib/schedule/types";

export type CalendarEventKind = "window" | "visit";

export interface CalendarEvent {
  /** Stable across exports of the same schedule: a calendar that imports the file again updates the event. */
  uid: string;
  kind: CalendarEventKind;
  start: Date;
  end: Date;
  summary: string;
  description: string;
  /** The target page at the event's night. */
  url: string;
}

/**
 * The caution every calendar carries: its events are times to point a telescope (the windows keep the
 * schedule's safe Sun elongation, but a calendar entry is read without the page's warnings).
 */

/** The instant of a Julian date (UTC) to the nearest whole second, the resolution of an iCalendar DATE-TIME (RFC 5545 §3.3.5). */
export function calendarInstant(jdUtc: number): Date {
  return new Date(Math.round(dateFromJdUtc(jdUtc).getTime() / 1000) * 1000);
}

/** The evening date of the schedule night holding `jdUtc` (nights run from local mean noon to noon). */
function nightIsoOf(schedule: ObservingSchedule, jdUtc: number): string {
  return addDaysIso(schedule.firstNightIso, Math.floor(jdUtc - schedule.cycle.startJdUtc));
}

/** Numbers each item within its night (1, 2, … per night), for UIDs that stay put when other nights change. */
function perNightOrdinals(schedule: ObservingSchedule, startsJdUtc: ArrayLike<number>): { nightIso: string; ordinal: number }[] {
  const out: { nightIso: string; ordinal: number }[] = [];
  for (let i = 0; i < startsJdUtc.length; i++) {
    const nightIso = nightIsoOf(schedule, startsJdUtc[i]);
    const previous = out.at(-1);
    out.push({ nightIso, ordinal: previous?.nightIso === nightIso ? previous.ordinal + 1 : 1 });
  }
  return out;
}

export interface TargetCalendarInput {
  target: SkyTarget & { id: string; name: string };
  site: SkySiteInput & { name: string };
  airmassLimit: number;
  schedule: ObservingSchedule;
  /** The target's photon budget (its visits' exposures), or null when it has none. */
  budget: TargetPhotonBudget | null;
  /** The visit's length less its overhead, s: what a visit leaves for exposing without a budget. */
  visitExposureS: number;
  /** Right-hand side of every UID (RFC 5545 §3.8.4.7: a domain name keeps them globally unique). */
  uidDomain: string;
  /** Absolute URL of the target's page. */
  targetUrl: string;
}

const airmassText = (airmass: number) => (Number.isFinite(airmass) ? airmass.toFixed(2) : "below the horizon");

/** Air mass (Pickering 2002, as the schedule's limit) of the target at `jdUtc`. */
function airmassAt(input: TargetCalendarInput, jdUtc: number): number {
  const { latitudeDeg, longitudeEastDeg, elevationM } = input.site;
  return airmassPickering(altitudeAzimuth({ latitudeDeg, longitudeEastDeg, elevationM }, { raDeg: input.target.raDeg, decDeg: input.target.decDeg }, jdUtc).apparentAltitudeDeg);
}

function windowDescription(input: TargetCalendarInput, w: TimeSpanJd): string {
  const hours = (w.endJdUtc - w.startJdUtc) * 24;
  const [start, middle, end] = [w.startJdUtc, (w.startJdUtc + w.endJdUtc) / 2, w.endJdUtc].map((jd) => airmassText(airmassAt(input, jd)));
  return [
    `${input.target.name} is observable from ${input.site.name} for ${hours.toFixed(2)} h: dark, above the air-mass limit ${input.airmassLimit}, clear of the Sun and the Moon by the proposal's rules, on a night the clear-night fraction keeps.`,
    `Air mass ${start} at the start, ${middle} mid-window, ${end} at the end (Pickering 2002).`,
    SUN_POINTING_CAUTION,
  ].join("\n");
}

function exposureText(input: TargetCalendarInput, visitIndex: number, budgetIndex: Map<number, number>): string {
  const budget = input.budget;
  const i = budget === null ? undefined : budgetIndex.get(input.schedule.visitsJdUtc[visitIndex]);
  if (budget === null || i === undefined) return `The visit leaves ${input.visitExposureS.toFixed(0)} s for exposing after its overhead.`;
  const needed = budget.series.exposureForGoalS[i];
  const saturation = budget.series.saturated[i] === 1 ? " The brightest pixel reaches the full well: split the exposure." : "";
  if (needed <= budget.visitExposureS) {
    return `Exposure ${needed.toFixed(0)} s reaches the S/N goal of ${budget.signalToNoiseGoal} in ${budget.bandLabel} (of ${budget.visitExposureS.toFixed(0)} s the visit leaves after a ${budget.overheadS.toFixed(0)} s overhead).${saturation}`;
  }
  return `The whole ${budget.visitExposureS.toFixed(0)} s the visit leaves reaches S/N ${budget.series.signalToNoise[i].toFixed(1)} in ${budget.bandLabel}, short of the goal of ${budget.signalToNoiseGoal}.${saturation}`;
}

function visitDescription(input: TargetCalendarInput, visitIndex: number, budgetIndex: Map<number, number>): string {
  const sky = input.schedule.visitSky;
  const minutes = input.schedule.visitLengthDays * 24 * 60;
  const moonUp = sky.moonZenithDeg[visitIndex] < 90;
  return [
    `Planned visit of ${minutes.toFixed(0)} min to ${input.target.name} from ${input.site.name}.`,
    `Air mass ${airmassText(sky.airmass[visitIndex])} at mid-visit (Pickering 2002); ${moonUp ? `the Moon is up, ${sky.moonSeparationDeg[visitIndex].toFixed(0)}° away` : "the Moon is down"}.`,
    exposureText(input, visitIndex, budgetIndex),
    SUN_POINTING_CAUTION,
  ].join("\n");
}

/** The windows and visits of one target's schedule as calendar events, windows first, each in time order. */
export function targetCalendarEvents(input: TargetCalendarInput): CalendarEvent[] {
  const { schedule, target } = input;
  const nightUrl = (nightIso: string) => `${input.targetUrl}?night=${nightIso}`;
  const windowNights = perNightOrdinals(schedule, schedule.windows.map((w) => w.startJdUtc));
  const windows = schedule.windows.map((w, i): CalendarEvent => {
    const { nightIso, ordinal } = windowNights[i];
    return {
      uid: `window-${target.id}-${nightIso}-${ordinal}@${input.uidDomain}`,
      kind: "window",
      start: calendarInstant(w.startJdUtc),
      end: calendarInstant(w.endJdUtc),
      summary: `${target.name}: observable window`,
      description: windowDescription(input, w),
      url: nightUrl(nightIso),
    };
  });
  const budgetIndex = new Map<number, number>();
  input.budget?.visitsJdUtc.forEach((jd, i) => budgetIndex.set(jd, i));
  const visitNights = perNightOrdinals(schedule, schedule.visitsJdUtc);
  const visits = Array.from(schedule.visitsJdUtc, (startJdUtc, i): CalendarEvent => {
    const { nightIso, ordinal } = visitNights[i];
    return {
      uid: `visit-${target.id}-${nightIso}-${ordinal}@${input.uidDomain}`,
      kind: "visit",
      start: calendarInstant(startJdUtc),
      end: calendarInstant(startJdUtc + schedule.visitLengthDays),
      summary: `${target.name}: planned visit`,
      description: visitDescription(input, i, budgetIndex),
      url: nightUrl(nightIso),
    };
  });
  return [...windows, ...visits];
}
