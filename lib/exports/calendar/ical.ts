/**
 * Calendar events as an iCalendar file (RFC 5545), written by ical-generator: times in UTC (DTSTART
 * and DTEND with a Z), the site as LOCATION with its GEO latitude and longitude, DTSTAMP the time of
 * export, and the export's provenance and the Sun caution in the calendar's description.
 */
import ical, { escape } from "ical-generator";
import { PRODUCT_NAME, PRODUCT_VERSION, provenanceLines, type Provenance } from "@/lib/exports/provenance";
import { SUN_POINTING_CAUTION } from "@/lib/astro/sun-caution";
import type { CalendarEvent } from "./events";

/** The media type of an iCalendar file (RFC 5545 §8.1). */
export const CALENDAR_CONTENT_TYPE = "text/calendar; charset=utf-8";

export interface CalendarFile {
  /** The calendar's name as a calendar program shows it. */
  name: string;
  site: { name: string; latitudeDeg: number; longitudeEastDeg: number };
  events: CalendarEvent[];
  provenance: Provenance;
}

/** The calendar as iCalendar text (CRLF line ends, lines folded at 75 octets by ical-generator). */
export function calendarIcs({ name, site, events, provenance }: CalendarFile): string {
  const calendar = ical({
    name,
    prodId: { company: PRODUCT_NAME, product: `${PRODUCT_NAME} ${PRODUCT_VERSION}`, language: "EN" },
    // ical-generator 11.1.2 writes X-WR-CALDESC as given, unlike an event's DESCRIPTION: a raw line
    // break would end the content line, so the text is escaped here (RFC 5545 §3.3.11).
    description: escape([SUN_POINTING_CAUTION, "", ...provenanceLines(provenance)].join("\n"), false),
  });
  const stamp = new Date(provenance.exportedAt);
  for (const event of events) {
    calendar.createEvent({
      id: event.uid,
      start: event.start,
      end: event.end,
      stamp,
      summary: event.summary,
      description: event.description,
      location: { title: site.name, geo: { lat: site.latitudeDeg, lon: site.longitudeEastDeg } },
      url: event.url,
    });
  }
  return calendar.toString();
}
