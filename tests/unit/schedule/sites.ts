/** Invented sites and targets shared by the schedule tests (not real observatories). */
import type { ScheduleConditions } from "@/lib/schedule";

export const southSite = { name: "Southern ridge (invented)", latitudeDeg: -30.2, longitudeEastDeg: -70.7, elevationM: 2200 };
export const northSite = { name: "Northern island (invented)", latitudeDeg: 28.8, longitudeEastDeg: -17.9, elevationM: 2300 };
/** A Galactic-bulge field, RA 17h57m, Dec −29°. */
export const bulge = { name: "Bulge field", raDeg: (17 + 57 / 60) * 15, decDeg: -29 };

/** Six months of 2022 around a June peak, airmass 2, a visit of 20 min every 4 h, no Moon rule. */
export const bulgeSeason: Omit<ScheduleConditions, "site"> = {
  cycleStartNightIso: "2022-03-01",
  cycleEndNightIso: "2022-08-31",
  limits: { airmassLimit: 2 },
  cadenceHours: 4,
  visitMinutes: 20,
};

/** Julian date (UTC) of an ISO instant. */
export function jd(iso: string): number {
  return Date.parse(iso) / 86_400_000 + 2_440_587.5;
}
