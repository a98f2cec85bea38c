/** How sky-window figures read on screen: UTC clock times and hours with one decimal. */
import { dateFromJdUtc } from "@/lib/astro/time";

/** "21:47" (UTC) for a Julian date, "—" for none. */
export function formatUtcClock(jdUtc: number | null): string {
  if (jdUtc === null) return "—";
  return dateFromJdUtc(jdUtc).toISOString().slice(11, 16);
}

/** "2022-06-21 21:47 UTC". */
export function formatUtcDateTime(jdUtc: number): string {
  const iso = dateFromJdUtc(jdUtc).toISOString();
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
}

/** "5.1 h". */
export function formatHours(hours: number): string {
  return `${hours.toFixed(1)} h`;
}
