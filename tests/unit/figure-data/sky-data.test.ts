import { describe, expect, it } from "vitest";
import { nightData, nightSkyData, seasonData } from "@/lib/exports/figure-data/sky-data";
import { nightInput, nightSkyInput, provenance, seasonInput } from "./inputs";
import { columnOf, expectWellFormed } from "./well-formed";

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("night data", () => {
  const visibility = nightInput();
  const table = nightData({ visibility, provenance });

  it("holds every sample of the night: time, the target's altitude and air mass, the Sun's and the Moon's altitude", () => {
    expectWellFormed(table);
    const { samples } = visibility;
    expect(columnOf(table, "time_jd_utc")).toEqual(Array.from(samples.jdUtc));
    expect(columnOf(table, "altitude")).toEqual(Array.from(samples.altitudeDeg));
    expect(columnOf(table, "sun_altitude")).toEqual(Array.from(samples.sunAltitudeDeg));
    expect(columnOf(table, "moon_altitude")).toEqual(Array.from(samples.moonAltitudeDeg));
    expect(columnOf(table, "airmass")).toEqual(Array.from(samples.airmass, (x) => (Number.isNaN(x) ? null : x)));
    expect(table.title).toBe("Altitude and air mass of Bulge field from Southern ridge (invented) through the night of 2022-06-20");
  });

  it("gives the ISO instant of each Julian date (JD 2440587.5 = 1970-01-01T00:00Z) and Pickering's air mass", () => {
    for (const [jd, iso, altitude, airmass] of table.rows as [number, string, number, number | null][]) {
      expect(Math.abs(Date.parse(iso) / 86_400_000 + 2_440_587.5 - jd)).toBeLessThan(1e-8);
      // X = 1/sin(h + 244/(165 + 47 h^1.1)), h apparent altitude in degrees (Pickering 2002, DIO 12, 20).
      if (altitude < 0) expect(airmass).toBeNull();
      else expect(relative(airmass!, 1 / Math.sin(((altitude + 244 / (165 + 47 * altitude ** 1.1)) * Math.PI) / 180))).toBeLessThan(1e-12);
    }
    // The bulge from latitude −30° culminates near the zenith: altitude above 85° at some sample.
    expect(Math.max(...(columnOf(table, "altitude") as number[]))).toBeGreaterThan(85);
  });
});

describe("night-sky data", () => {
  const sky = nightSkyInput();
  const table = nightSkyData({ sky, provenance });

  it("holds every drawn sample: the sky with and without the Moon, the Moon's light and its brightening", () => {
    expectWellFormed(table);
    expect(columnOf(table, "time_jd_utc")).toEqual(Array.from(sky.jdUtc));
    expect(columnOf(table, "sky_brightness")).toEqual(Array.from(sky.totalMagPerArcsec2));
    expect(columnOf(table, "dark_sky_brightness")).toEqual(Array.from(sky.darkMagPerArcsec2));
    expect(columnOf(table, "moon_sky_brightness")).toEqual(Array.from(sky.moonMagPerArcsec2, (m) => (Number.isFinite(m) ? m : null)));
    const brightening = columnOf(table, "moon_brightening") as number[];
    expect(Math.max(...brightening)).toBe(sky.largestMoonBrighteningMag);
    // The Moon rises during this night: some rows without it, some with it.
    expect(columnOf(table, "moon_sky_brightness")).toContain(null);
    expect(brightening.some((mag) => mag > 0.1)).toBe(true);
  });

  it("adds the Moon's light to the dark sky in flux: 10^(−0.4 m) = 10^(−0.4 m_dark) + 10^(−0.4 m_moon)", () => {
    // Surface brightnesses in magnitudes add as fluxes (Pogson's relation; Krisciunas & Schaefer 1991 sum the two in flux).
    for (const [, , total, dark, moon] of table.rows as [number, string, number, number, number | null][]) {
      const flux = 10 ** (-0.4 * dark) + (moon === null ? 0 : 10 ** (-0.4 * moon));
      expect(relative(10 ** (-0.4 * total), flux)).toBeLessThan(1e-12);
    }
  });
});

describe("season data", () => {
  const { schedules, view, targetIndices } = seasonInput();
  const table = seasonData({ view, targetIndices, provenance });

  it("holds one row per target and night with the schedule's usable hours and the Sun flag", () => {
    expectWellFormed(table);
    expect(table.rows).toHaveLength(4 * 30);
    expect(columnOf(table, "target", (row) => row[1] === "2022-06-01")).toEqual(["Bulge field", "Disk field Ω", "Northern field", "HE 0435−1223"]);
    schedules.forEach((schedule, index) => {
      const name = view.rows[index].name;
      const ofTarget = (row: unknown[]) => row[0] === name;
      expect(columnOf(table, "usable_hours", ofTarget)).toEqual(Array.from(schedule.usableHoursPerNight));
      expect(columnOf(table, "too_close_to_sun", ofTarget)).toEqual(Array.from(view.rows[index].tooCloseToSunPerNight));
      expect(columnOf(table, "night", ofTarget)).toEqual(Array.from({ length: 30 }, (_, n) => `2022-06-${String(n + 1).padStart(2, "0")}`));
    });
    // June from −30°: the bulge is up most of the long night, the northern field (Dec +40°) never above air mass 2.
    expect(Math.max(...(columnOf(table, "usable_hours", (row) => row[0] === "Bulge field") as number[]))).toBeGreaterThan(6);
    expect(new Set(columnOf(table, "usable_hours", (row) => row[0] === "Northern field"))).toEqual(new Set([0]));
    // RA 4.6 h lies within ~25 deg of the June Sun (RA ~5-6.6 h): no usable hour in the month.
    expect(new Set(columnOf(table, "usable_hours", (row) => row[0] === "HE 0435−1223"))).toEqual(new Set([0]));
  });
});
