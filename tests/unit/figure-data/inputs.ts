/**
 * The figures' own data, computed as the figure exports compute it (lib/bench plot data, lib/astro
 * night, lib/photometry night sky, lib/schedule season), for the figure-data tests (unit and
 * integration). Sites and targets are invented.
 */
import { benchSchedule, benchScheduleRequest } from "@/lib/bench/case-report";
import { computeResults, type MicrolensingEvent } from "@/lib/bench/compute-results";
import { naturalAngleUnit } from "@/lib/bench/display-units";
import { parseSketch } from "@/lib/bench/parse-sketch";
import { astrometricTrack, deflectionCurves, lightCurve } from "@/lib/bench/plot-data";
import { demoSketch } from "@/lib/bench/sketch-state";
import { nightlyVisibility } from "@/lib/astro/visibility";
import { buildProvenance } from "@/lib/exports/provenance";
import { seasonViewOfSchedules } from "@/lib/figures/season-view";
import { nightSkyBrightness } from "@/lib/photometry/night-sky";
import { observingSchedules } from "@/lib/schedule";
import { bandSkyOf, defaultPhotometrySettings } from "@/lib/workspace/photometry-schema";

export const provenance = buildProvenance({
  subject: "Figure data test",
  reproduceUrl: "http://arcwright.test/bench",
  // Characters whose UTF-8 bytes STILTS 3.4 would misread in an ECSV header unless escaped (U+2212,
  // an en dash, Ś): astropy and STILTS must read them back as written.
  inputs: { figure: "test", site: "Southern ridge (invented)", target: "HE 0435−1223 – Śrī Ω" },
  exportedAt: new Date("2031-02-03T04:05:06.000Z"),
});

/** The demo sketch over a six-week cycle holding its peak (a cheap schedule), as the bench computes it. */
export function benchInputs() {
  const parsed = parseSketch({ ...demoSketch, cycleStart: "2027-06-20", cycleEnd: "2027-07-31", campaign: "30 d" });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
  const computed = computeResults(parsed.inputs);
  if (!computed.ok) throw new Error(computed.message);
  const { results } = computed;
  const event = results.event!;
  const schedule = benchSchedule(benchScheduleRequest(parsed.inputs)!);
  return {
    results,
    event,
    schedule,
    // The units bench-figures.ts draws in: θ_E's for the lens plane, θ_E/3's for the centroid shift.
    lensPlaneUnit: naturalAngleUnit(results.lensPlane.thetaERad),
    shiftUnit: naturalAngleUnit(results.lensPlane.thetaERad / 3),
    lightCurve: lightCurve(event, schedule),
    track: astrometricTrack(event, schedule),
    curves: deflectionCurves(),
  };
}

/** A point-source event (no finite-source or occultation term): the light curve is Paczyński's exactly. */
export const pointSourceEvent: MicrolensingEvent = {
  thetaERad: 4.8e-9,
  einsteinTimeS: 20 * 86_400,
  peakTimeS: 15 * 86_400,
  campaignStartJdUtc: 2_461_900.5,
  u0ThetaE: 0.1,
  cadenceS: 86_400,
  campaignS: 30 * 86_400,
  sourceRadiusThetaE: null,
  limbDarkeningU: 0,
  occultingRadiusThetaE: 0,
};

export const site = { name: "Southern ridge (invented)", latitudeDeg: -30.2, longitudeEastDeg: -70.7, elevationM: 2200, horizonLimitDeg: 20 };
/** A Galactic-bulge field, RA 17h57m, Dec −29°. */
export const bulge = { name: "Bulge field", raDeg: (17 + 57 / 60) * 15, decDeg: -29 };
const disk = { name: "Disk field Ω", raDeg: 270, decDeg: -20 };
const north = { name: "Northern field", raDeg: 120, decDeg: 40 };
/** The lensed quasar named with a true minus, as copied from papers (RA 04h38m14.9s, Dec −12°17′14″, from memory). */
const quasar = { name: "HE 0435−1223", raDeg: 69.562, decDeg: -12.287 };

/** Last quarter: the Moon rises in the small hours of 21 June 2022 UTC, during the bulge's night. */
export const nightIso = "2022-06-20";

export function nightInput() {
  return nightlyVisibility(site, bulge, nightIso, { airmassLimit: 2 });
}

export function nightSkyInput() {
  const found = bandSkyOf(defaultPhotometrySettings, "jc-i");
  if (!("sky" in found)) throw new Error(found.missing);
  return nightSkyBrightness({ site, target: bulge, nightDateIso: nightIso, bandSky: found.sky });
}

/** Four targets over 30 nights of 2022, as the proposal's season figure computes them. */
export function seasonInput() {
  const targets = [bulge, disk, north, quasar];
  const schedules = observingSchedules({ site, cycleStartNightIso: "2022-06-01", cycleEndNightIso: "2022-06-30", limits: { airmassLimit: 2 }, cadenceHours: 4, visitMinutes: 20, targets });
  return { schedules, view: seasonViewOfSchedules(targets.map((t) => t.name), schedules), targetIndices: targets.map((_, index) => index) };
}
