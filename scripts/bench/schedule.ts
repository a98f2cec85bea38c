// Simulated observing schedule speed (issue 16 item 9): schedules for 1,000 targets over a 183-night
// cycle against the 2 s target, and one target's schedule (the target page) against 100 ms. Prints
// figures and ratios only; never passes or fails on timing. Baselines in the same process: the
// season view's usable hours for the same targets and nights (`seasonWindows`: no Moon, no visits,
// no gaps), and the schedules computed one target at a time (no night shared between targets).
import { cpus, loadavg } from "node:os";
import type { NightGrid } from "@/lib/astro/night-grid";
import { nightMoon } from "@/lib/astro/night-moon";
import { refractionScale } from "@/lib/astro/refraction";
import { seasonWindows } from "@/lib/astro/season";
import { nightStartJdUtc } from "@/lib/astro/time";
import { observingSchedule, observingSchedules, type ObservingSchedule, type ScheduleConditions } from "@/lib/schedule";
import { buildScheduleNight } from "@/lib/schedule/night";
import { parseScheduleConditions } from "@/lib/schedule/request";
import { VisitSkyNights } from "@/lib/schedule/visit-sky";
import { deriveMany } from "@/lib/server/derived-columns";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";
import { bestSeconds, fibonacciSky } from "../lib/bench-sky";

const MANY_TARGET_SECONDS = 2;
const ONE_TARGET_SECONDS = 0.1;
const TARGET_COUNT = 1000;
const UNSHARED_SAMPLE = 10;
const site = { name: "Bench site (invented)", latitudeDeg: -30.2, longitudeEastDeg: -70.7, elevationM: 2200, horizonLimitDeg: 15 };
const conditions: ScheduleConditions = {
  site,
  cycleStartNightIso: "2027-02-01",
  cycleEndNightIso: "2027-08-02", // 183 nights
  limits: { airmassLimit: 2 },
  moon: { minSeparationDeg: 30, maxIlluminatedFraction: 0.6 },
  cadenceHours: 4,
  visitMinutes: 20,
  clearNightFraction: 0.7,
};
const NIGHT_COUNT = 183;

const targets = fibonacciSky(TARGET_COUNT);
const bulge = { name: "Bulge field", raDeg: 269.25, decDeg: -29 };

console.log(`schedule bench, load average ${loadavg().map((value) => value.toFixed(1)).join(" ")} on ${cpus().length} CPUs (timings of a shared machine are upper bounds)`);
// One untimed run warms the JIT, as a worker that has served a request before would be.
observingSchedules({ ...conditions, cycleEndNightIso: "2027-02-10", targets: targets.slice(0, 20) });

let visits = 0;
let empty = 0;
let schedules: ObservingSchedule[] = [];
const manySeconds = bestSeconds(() => {
  schedules = observingSchedules({ ...conditions, targets });
  visits = schedules.reduce((sum, schedule) => sum + schedule.visitsJdUtc.length, 0);
  empty = schedules.filter((schedule) => schedule.emptyReason !== null).length;
}, 3);
const seasonSeconds = bestSeconds(() => seasonWindows({ site, targets, startNightIso: conditions.cycleStartNightIso, nightCount: NIGHT_COUNT, limits: conditions.limits }), 3);
const unsharedSeconds = (bestSeconds(() => {
  for (const target of targets.slice(0, UNSHARED_SAMPLE)) observingSchedule({ ...conditions, target });
}, 2) / UNSHARED_SAMPLE) * TARGET_COUNT;
console.log(`(a) ${TARGET_COUNT} targets × ${NIGHT_COUNT} nights: ${manySeconds.toFixed(3)} s (best of 3); ${(manySeconds / MANY_TARGET_SECONDS).toFixed(3)} of the ${MANY_TARGET_SECONDS} s target; ` +
  `${visits} visits, ${empty} targets with none`);
console.log(`    baseline, the season view's hours for the same targets and nights: ${seasonSeconds.toFixed(3)} s; the schedule costs ${(manySeconds / seasonSeconds).toFixed(2)}x`);
console.log(`    baseline, one target at a time (${UNSHARED_SAMPLE} timed, scaled to ${TARGET_COUNT}): ${unsharedSeconds.toFixed(1)} s; sharing the nights is ${(unsharedSeconds / manySeconds).toFixed(0)}x faster`);

let bulgeVisits = 0;
const oneSeconds = bestSeconds(() => {
  bulgeVisits = observingSchedule({ ...conditions, target: bulge }).visitsJdUtc.length;
}, 5);
const oneSeasonSeconds = bestSeconds(() => seasonWindows({ site, targets: [bulge], startNightIso: conditions.cycleStartNightIso, nightCount: NIGHT_COUNT, limits: conditions.limits }), 5);
console.log(`(b) one target (the bulge) over ${NIGHT_COUNT} nights: ${(oneSeconds * 1000).toFixed(1)} ms (best of 5); ${(oneSeconds / ONE_TARGET_SECONDS).toFixed(3)} of the ${ONE_TARGET_SECONDS * 1000} ms target; ${bulgeVisits} visits`);
console.log(`    baseline, the season view's hours for that target: ${(oneSeasonSeconds * 1000).toFixed(1)} ms; the schedule costs ${(oneSeconds / oneSeasonSeconds).toFixed(2)}x`);

// (d) What the sky at each visit (air mass, zenith distances, the Moon; `visit-sky.ts`) adds to (a):
// its per-visit arithmetic for every visit of (a), and the Moon, which every night now computes
// (before, only nights with a Moon rule did; (a) has one, so there it was paid already).
const planSettings = parseScheduleConditions(conditions);
const skyNights = new VisitSkyNights(planSettings.site, nightStartJdUtc(planSettings.firstNightIso, site.longitudeEastDeg), NIGHT_COUNT, refractionScale(site.elevationM));
const grids: NightGrid[] = [];
for (let index = 0; index < NIGHT_COUNT; index++) {
  const night = buildScheduleNight(planSettings, index);
  skyNights.add(night);
  grids.push(night.grid);
}
const skySeconds = bestSeconds(() => {
  schedules.forEach((schedule, t) => skyNights.skyOf(targets[t], schedule.visitsJdUtc, schedule.visitLengthDays));
}, 3);
const moonSeconds = bestSeconds(() => {
  for (const grid of grids) nightMoon(grid, planSettings.site);
}, 3);
console.log(`(d) the sky at each visit, ${visits} visits of (a): ${(skySeconds * 1000).toFixed(1)} ms (best of 3), ${((skySeconds / visits) * 1e6).toFixed(2)} µs per visit; ` +
  `${((skySeconds / manySeconds) * 100).toFixed(1)}% of (a)`);
console.log(`    the Moon on every night, now also without a Moon rule: ${(moonSeconds * 1000).toFixed(1)} ms per ${NIGHT_COUNT} nights; ` +
  `${((moonSeconds / oneSeconds) * 100).toFixed(0)}% of one target's schedule (b), ${((moonSeconds / manySeconds) * 100).toFixed(1)}% of (a)`);

// (c) The stored columns of a whole proposal: schedules and every science case's answers for 1,000
// targets (the 2 s budget covers both), against the schedules alone from (a).
const settings = {
  site: { name: site.name, latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeEastDeg, elevationM: site.elevationM, horizonLimitDeg: site.horizonLimitDeg },
  instrument: instrumentSchema.parse({
    resolutionMas: 50,
    cadenceHours: conditions.cadenceHours,
    campaignLengthDays: 90,
    visitMinutes: conditions.visitMinutes,
    clearNightFraction: conditions.clearNightFraction,
    moonMinSeparationDeg: 30,
    moonMaxIllumination: 0.6,
    astrometricPrecisionMas: 0.1,
    reachableContrast: 100,
    interferometerWavelengthMm: 1.3,
    interferometerBaselineKm: 10_700,
  }),
  cycleStartDate: conditions.cycleStartNightIso,
  cycleEndDate: conditions.cycleEndNightIso,
  photometry: null,
};
const peakJdUtc = 2_461_570.5; // 2027-06-14
const hypotheses = [
  { lensModel: "point" as const, lensMassSolar: 0.3, lensDistancePc: 4000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.1, properMotionMasPerYr: 5, eventPeakJdUtc: peakJdUtc },
  { lensModel: "point" as const, lensMassSolar: 0.5, lensDistancePc: 6000, sourceDistancePc: 8000, sourceOffsetThetaE: 0.02, properMotionMasPerYr: 6, eventPeakJdUtc: peakJdUtc, sourceRadiusSolar: 1.2, limbDarkeningU: 0.6 },
  { lensModel: "point" as const, lensMassSolar: 7, lensDistancePc: 2000, sourceDistancePc: 8000, sourceOffsetThetaE: 1.5, properMotionMasPerYr: 3, eventPeakJdUtc: peakJdUtc, scienceCase: "astrometric-microlensing" as const },
  { lensModel: "sis" as const, velocityDispersionKmPerS: 250, lensRedshift: 0.4, sourceRedshift: 1.8, sourceOffsetThetaE: 0.3, scienceCase: "time-delay" as const },
  { lensModel: "sis" as const, velocityDispersionKmPerS: 220, lensRedshift: 0.3, sourceRedshift: 1.2, sourceOffsetThetaE: 0.5 },
  { lensModel: "point" as const, lensMassSolar: 4e6, lensDistancePc: 8000, sourceDistancePc: 8500, sourceOffsetThetaE: 2, scienceCase: "horizon-scale" as const },
];
const rows = targets.map((target, index) => ({ ...hypotheses[index % hypotheses.length], raDeg: target.raDeg, decDeg: target.decDeg }));
let answered = 0;
const derivedSeconds = bestSeconds(() => {
  answered = deriveMany(rows, settings).reduce((sum, columns) => sum + columns.caseAnswers.length, 0);
}, 3);
console.log(`(c) ${TARGET_COUNT} targets' stored columns (schedules and science-case answers, six hypotheses in turn): ${derivedSeconds.toFixed(3)} s (best of 3); ` +
  `${(derivedSeconds / MANY_TARGET_SECONDS).toFixed(3)} of the ${MANY_TARGET_SECONDS} s target; ${answered} answers`);
console.log(`    baseline, the schedules alone (a): ${manySeconds.toFixed(3)} s; the lensing and the answers add ${(derivedSeconds / manySeconds).toFixed(2)}x`);
