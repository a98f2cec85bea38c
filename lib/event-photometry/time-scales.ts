/**
 * Time scales of photometry files: UTC, TT and TDB, as Julian dates (days). UTC Julian dates count
 * 86400-s days as the product's clocks do (POSIX time, `lib/astro/time.ts`); ERFA and astropy
 * stretch a day that ends in a leap second to 86401 s, so on such a day the two differ by up to 1 s
 * (the last second of the day has no POSIX time and reads as the next day's first).
 */

const SECONDS_PER_DAY = 86_400;

/** TT − TAI, seconds (IAU 1991 Resolution A4: TT is TAI + 32.184 s). */
const TT_MINUS_TAI_S = 32.184;

/**
 * TAI − UTC (seconds) from each UTC Julian date on (IERS Bulletin C; the dates and steps from
 * memory, checked against astropy 5.2's ERFA table by tests/fixtures/generate_event_photometry.py
 * across the leap second at the end of 2016-12-31). The table starts in 1988, before the 1990 that
 * photometry is accepted from; no leap second has been announced after 2017-01-01 (from memory),
 * so 37 s holds to the end of the table's use: a later leap second needs a row here.
 */
const LEAP_SECONDS: readonly (readonly [jdUtc: number, taiMinusUtcS: number])[] = [
  [2_447_161.5, 24], // 1988-01-01
  [2_447_892.5, 25], // 1990-01-01
  [2_448_257.5, 26], // 1991-01-01
  [2_448_804.5, 27], // 1992-07-01
  [2_449_169.5, 28], // 1993-07-01
  [2_449_534.5, 29], // 1994-07-01
  [2_450_083.5, 30], // 1996-01-01
  [2_450_630.5, 31], // 1997-07-01
  [2_451_179.5, 32], // 1999-01-01
  [2_453_736.5, 33], // 2006-01-01
  [2_454_832.5, 34], // 2009-01-01
  [2_456_109.5, 35], // 2012-07-01
  [2_457_204.5, 36], // 2015-07-01
  [2_457_754.5, 37], // 2017-01-01
];

/** TAI − UTC in seconds at the UTC Julian date `jdUtc` (from 1988-01-01 on; earlier dates get 1988's 24 s). */
export function taiMinusUtcSeconds(jdUtc: number): number {
  let seconds = LEAP_SECONDS[0][1];
  for (const [startJd, value] of LEAP_SECONDS) if (jdUtc >= startJd) seconds = value;
  return seconds;
}

/** TT Julian date of the UTC Julian date `jdUtc`: TT = UTC + (TAI − UTC) + 32.184 s. Exact, to rounding. */
export function jdTtFromJdUtc(jdUtc: number): number {
  return jdUtc + (taiMinusUtcSeconds(jdUtc) + TT_MINUS_TAI_S) / SECONDS_PER_DAY;
}

/**
 * UTC Julian date of the TT Julian date `jdTt`: the inverse of `jdTtFromJdUtc`, with TAI − UTC taken
 * at the UTC date found with the TAI − UTC of the TT date (right except within the leap second itself).
 */
export function jdUtcFromJdTt(jdTt: number): number {
  const first = jdTt - (taiMinusUtcSeconds(jdTt) + TT_MINUS_TAI_S) / SECONDS_PER_DAY;
  return jdTt - (taiMinusUtcSeconds(first) + TT_MINUS_TAI_S) / SECONDS_PER_DAY;
}

/**
 * TDB − TT in seconds at the Julian date `jd` (TT or TDB: the difference is 1.7 ms): the two leading
 * periodic terms of the Fairhead & Bretagnon 1990 (A&A 229, 240) series as the Astronomical Almanac
 * and G. H. Kaplan 2005 (USNO Circular 179, eq. 2.6) give them, 0.001657 sin g + 0.000014 sin 2g with
 * the Earth's mean anomaly g = 357.53° + 0.98560028° (JD − 2451545.0) (coefficients from memory;
 * checked against astropy's TDB, the full series, to 3e-5 s by the fixture). Geocentre only: the
 * observatory's term (≤ 2 µs) is left out.
 */
export function tdbMinusTtSeconds(jd: number): number {
  const g = ((357.53 + 0.98560028 * (jd - 2_451_545.0)) * Math.PI) / 180;
  return 0.001657 * Math.sin(g) + 0.000014 * Math.sin(2 * g);
}

/** The three time scales a photometry file's times may be in. */
export const timeScales = ["UTC", "TT", "TDB"] as const;
export type TimeScale = (typeof timeScales)[number];

/** The UTC Julian date of a geocentric Julian date `jd` in the time scale `scale`. */
export function jdUtcFromScale(jd: number, scale: TimeScale): number {
  switch (scale) {
    case "UTC":
      return jd;
    case "TT":
      return jdUtcFromJdTt(jd);
    case "TDB":
      return jdUtcFromJdTt(jd - tdbMinusTtSeconds(jd) / SECONDS_PER_DAY);
  }
}

/** The TT Julian date of a geocentric Julian date `jd` in the time scale `scale` (for an ephemeris). */
export function jdTtFromScale(jd: number, scale: TimeScale): number {
  switch (scale) {
    case "UTC":
      return jdTtFromJdUtc(jd);
    case "TT":
      return jd;
    case "TDB":
      return jd - tdbMinusTtSeconds(jd) / SECONDS_PER_DAY;
  }
}
