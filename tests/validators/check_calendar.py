#!/usr/bin/python3
"""Reads an iCalendar file with Debian's python3-icalendar (an independent RFC 5545 parser) and prints
what the calendar test compares: every VEVENT's UID, DTSTAMP, DTSTART, DTEND (Unix seconds, UTC),
SUMMARY, LOCATION and GEO, and the calendar's description, as JSON on stdout.

Refuses (exit 1, reason on stderr) a file that does not parse, a calendar without VERSION or
PRODID, an event missing UID, DTSTAMP, DTSTART or DTEND, a time that is not in UTC, or a DTEND not
after its DTSTART.

Usage: /usr/bin/python3 tests/validators/check_calendar.py FILE.ics
"""
import json
import sys
from datetime import timezone

import icalendar


def fail(message):
    print(message, file=sys.stderr)
    sys.exit(1)


def utc_seconds(event, name):
    value = event.get(name)
    if value is None:
        fail(f"{event.get('UID')}: no {name}")
    moment = value.dt
    if getattr(moment, "tzinfo", None) is None or moment.utcoffset().total_seconds() != 0:
        fail(f"{event.get('UID')}: {name} {moment!r} is not a UTC date-time")
    return int(moment.astimezone(timezone.utc).timestamp())


def main(path):
    with open(path, "rb") as handle:
        data = handle.read()
    try:
        calendar = icalendar.Calendar.from_ical(data)
    except Exception as error:  # the parser's own message is the reason
        fail(f"does not parse: {error}")
    for name in ("VERSION", "PRODID"):
        if calendar.get(name) is None:
            fail(f"the calendar has no {name}")
    events = []
    for event in calendar.walk("VEVENT"):
        if event.get("UID") is None:
            fail("an event has no UID")
        start = utc_seconds(event, "DTSTART")
        end = utc_seconds(event, "DTEND")
        if end <= start:
            fail(f"{event.get('UID')}: DTEND is not after DTSTART")
        geo = event.get("GEO")
        events.append(
            {
                "uid": str(event.get("UID")),
                "dtstamp": utc_seconds(event, "DTSTAMP"),
                "start": start,
                "end": end,
                "summary": str(event.get("SUMMARY")),
                "location": str(event.get("LOCATION")),
                "geo": None if geo is None else [geo.latitude, geo.longitude],
                "description": str(event.get("DESCRIPTION")),
            }
        )
    description = calendar.get("X-WR-CALDESC")
    print(
        json.dumps(
            {
                "icalendarVersion": icalendar.__version__,
                "version": str(calendar.get("VERSION")),
                "description": None if description is None else str(description),
                "events": events,
            }
        )
    )


if __name__ == "__main__":
    main(sys.argv[1])
