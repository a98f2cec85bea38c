#!/usr/bin/python3
"""Reads the target table exports with the tools astronomers trust and reports every loss.

Usage: /usr/bin/python3 tests/validators/check_tables.py DIR

DIR holds the exports and `expected.json`, written by tests/integration/exports-tables.test.ts:
  {"files": {"votable"|"csv"|"ecsv": {"path", "columns": [{"name", "unit", "description"?}],
   "rows": [[number | string | null, ...]], "sexagesimal"?: [{"text", "degrees", "unit", "precision"}]}},
   "provenance": {...}}
Each file is read with astropy (Debian's python3-astropy; the VOTable with verify='exception', so
any warning fails), written back by astropy (the VOTable as TABLEDATA and as BINARY2) and read
again; every file is also read by STILTS (`stilts tpipe`, Debian's stilts) and the VOTable checked
by `stilts votlint`. Numbers must agree with the expected values to 1e-9
relative, units (VOTable, ECSV) must name the same unit, and the ECSV header must carry the
provenance. A sexagesimal column (`text`, RA in "hourangle" or Dec in "deg" with `precision`
decimals of a second) must be colon-separated ASCII and parse back with astropy's `Angle` to the
degrees column beside it within half its last digit (RA modulo 24 h). Parsing is the check, not
equality with `Angle.to_string(sep=':')`: astropy 5.2 rounds a value just below a carry up
(10:06:59.99925 to 10:07:00.000, off by 11 mas at precision 3; 2 in 20,000 random positions). The STILTS processes run beside the astropy checks: one JVM per file.

Prints a JSON report {"problems": [...], "versions": {...}} and exits 1 when there is a problem.
"""
import io
import json
import math
import re
import subprocess
import sys
import warnings
from pathlib import Path

import astropy
import numpy as np
from astropy import units as u
from astropy.coordinates import Angle
from astropy.io import ascii as astropy_ascii
from astropy.io.votable import parse as parse_votable
from astropy.table import Table

RELATIVE_TOLERANCE = 1e-9

problems: list[str] = []


def cell(column, row: int):
    """A table cell as a Python value: None when masked, NaN or an empty text."""
    if np.ma.is_masked(column[row]):
        return None
    value = column[row]
    if isinstance(value, (bytes, np.bytes_)):
        value = value.decode("utf-8")
    if isinstance(value, (str, np.str_)):
        return None if str(value) == "" else str(value)
    if isinstance(value, np.floating) and value.dtype == np.float32:
        # A 32-bit column (STILTS's choice for short decimals) holds the decimal it was read from.
        return float(repr(value))
    number = float(value)
    return None if math.isnan(number) else number


def same_value(actual, expected) -> bool:
    if expected is None:
        return actual is None
    if isinstance(expected, str):
        return actual == expected
    if not isinstance(actual, float):
        return False
    if expected == 0:
        return actual == 0
    return abs(actual - expected) <= RELATIVE_TOLERANCE * abs(expected)


def same_unit(actual, expected: str | None) -> bool:
    if expected is None:
        return actual is None
    return actual is not None and u.Unit(actual) == u.Unit(expected, format="vounit")


def compare(label: str, table: Table, spec: dict, check_units: bool, text_as_latin1: bool = False) -> None:
    """Every expected column present, in rows of the expected values and (when asked) units.

    `text_as_latin1`: the reader takes each byte of the file for one character (STILTS 3.4's CSV
    and ECSV readers do; its CSV reader has no encoding option, and ECSV 1.0 (APE6) speaks of
    ASCII only), so the UTF-8 bytes of a text must come back one character per byte: the bytes
    survive, nothing is lost or replaced.
    """
    if len(table) != len(spec["rows"]):
        problems.append(f"{label}: {len(table)} rows, expected {len(spec['rows'])}")
        return
    for index, column_spec in enumerate(spec["columns"]):
        name = column_spec["name"]
        if name not in table.colnames:
            problems.append(f"{label}: no column {name!r} (has {table.colnames})")
            continue
        column = table[name]
        if check_units and not same_unit(column.unit, column_spec["unit"]):
            problems.append(f"{label}: column {name!r} has unit {column.unit!s}, expected {column_spec['unit']}")
        for row, values in enumerate(spec["rows"]):
            actual = cell(column, row)
            expected = values[index]
            if text_as_latin1 and isinstance(expected, str):
                expected = expected.encode("utf-8").decode("latin-1")
            if not same_value(actual, expected):
                problems.append(f"{label}: row {row + 1} column {name!r} reads {actual!r}, expected {values[index]!r}")
    check_sexagesimal(label, table, spec)


def check_sexagesimal(label: str, table: Table, spec: dict) -> None:
    """Each sexagesimal text colon-separated with its stated decimals, read back by astropy within half its last digit."""
    for pair in spec.get("sexagesimal", []):
        if pair["text"] not in table.colnames or pair["degrees"] not in table.colnames:
            problems.append(f"{label}: no column {pair['text']!r} beside {pair['degrees']!r}")
            continue
        unit = u.hourangle if pair["unit"] == "hourangle" else u.deg
        # Half the last digit of the seconds, as an angle in degrees (a second of time is 15 arcsec).
        half_digit_deg = 0.5 * 10.0 ** -pair["precision"] / 3600 * (15 if unit == u.hourangle else 1)
        shape = re.compile(rf"^{'' if unit == u.hourangle else '[+-]'}\d{{2}}:\d{{2}}:\d{{2}}\.\d{{{pair['precision']}}}$")
        for row in range(len(table)):
            text, degrees = cell(table[pair["text"]], row), cell(table[pair["degrees"]], row)
            if not isinstance(text, str) or not shape.match(text):
                problems.append(f"{label}: row {row + 1} {pair['text']!r} reads {text!r}, not sexagesimal with {pair['precision']} decimals")
                continue
            parsed = Angle(text, unit=unit).deg
            difference = (parsed - degrees + 180) % 360 - 180 if unit == u.hourangle else parsed - degrees
            if abs(difference) > half_digit_deg * (1 + 1e-9):
                problems.append(f"{label}: row {row + 1} {pair['text']!r} {text!r} parses to {parsed!r} deg, {degrees!r} deg beside it")


def check_votable(directory: Path, spec: dict) -> None:
    path = directory / spec["path"]
    try:
        document = parse_votable(str(path), verify="exception")
    except Exception as error:  # every astropy warning is an error here
        problems.append(f"astropy VOTable parse: {error}")
        return
    compare("astropy VOTable", document.get_first_table().to_table(), spec, check_units=True)
    # Written back as astropy writes it (FIELD precision applied to TABLEDATA), in XML rows and in
    # BINARY2, then read again.
    for serialization in ("tabledata", "binary2"):
        rewritten = io.BytesIO()
        document.to_xml(rewritten, tabledata_format=serialization)
        rewritten.seek(0)
        reread = parse_votable(rewritten, verify="exception")
        compare(f"astropy VOTable rewrite ({serialization})", reread.get_first_table().to_table(), spec, check_units=True)


def check_csv(directory: Path, spec: dict) -> None:
    try:
        table = astropy_ascii.read(str(directory / spec["path"]), format="csv")
    except Exception as error:
        problems.append(f"astropy CSV read: {error}")
        return
    compare("astropy CSV", table, spec, check_units=False)
    rewritten = io.StringIO()
    table.write(rewritten, format="ascii.csv")
    compare("astropy CSV rewrite", astropy_ascii.read(rewritten.getvalue(), format="csv"), spec, check_units=False)


def check_ecsv(directory: Path, spec: dict, provenance: dict) -> None:
    try:
        with warnings.catch_warnings():
            warnings.simplefilter("error")
            table = Table.read(str(directory / spec["path"]), format="ascii.ecsv")
    except Exception as error:
        problems.append(f"astropy ECSV read: {error}")
        return
    for label, candidate in [("astropy ECSV", table), ("astropy ECSV rewrite", None)]:
        if candidate is None:
            rewritten = io.StringIO()
            table.write(rewritten, format="ascii.ecsv")
            candidate = Table.read(rewritten.getvalue(), format="ascii.ecsv")
        compare(label, candidate, spec, check_units=True)
        for column_spec in spec["columns"]:
            name = column_spec["name"]
            if name in candidate.colnames and candidate[name].description != column_spec.get("description"):
                problems.append(f"{label}: column {name!r} described as {candidate[name].description!r}")
        if json.loads(json.dumps(dict(candidate.meta), default=str)) != provenance:
            problems.append(f"{label}: meta is {dict(candidate.meta)!r}, expected the provenance record")


def start_stilts(directory: Path, files: dict) -> dict[str, tuple[subprocess.Popen, Path | None]]:
    """One STILTS process per file, started before the astropy checks so the JVMs run beside them."""
    started = {}
    if "votable" in files:
        command = ["stilts", "votlint", f"votable={directory / files['votable']['path']}"]
        started["votlint"] = (subprocess.Popen(command, stdout=subprocess.PIPE, stderr=subprocess.STDOUT, text=True), None)
    for kind in ("csv", "ecsv", "votable"):
        if kind in files:
            out = directory / f"{kind}-by-stilts.vot"
            command = ["stilts", "tpipe", f"in={directory / files[kind]['path']}", f"ifmt={kind}", "ofmt=votable", f"out={out}"]
            started[kind] = (subprocess.Popen(command, stdout=subprocess.PIPE, stderr=subprocess.STDOUT, text=True), out)
    return started


def finish_stilts(started: dict, files: dict) -> None:
    for kind, (process, out) in started.items():
        output, _ = process.communicate(timeout=120)
        if kind == "votlint":
            # votlint prints nothing for a valid document; every line is a warning or an error.
            if process.returncode != 0 or output.strip() != "":
                problems.append(f"stilts votlint: {output.strip() or f'exit {process.returncode}'}")
            continue
        if process.returncode != 0:
            problems.append(f"stilts tpipe ifmt={kind}: {output.strip()}")
            continue
        # STILTS's own VOTable, read leniently: its warnings are about STILTS's file, not ours.
        table = parse_votable(str(out), verify="ignore").get_first_table().to_table(use_names_over_ids=True)
        # STILTS 3.4's CSV and ECSV readers take each byte for a character; its VOTable reader decodes UTF-8.
        compare(f"stilts tpipe ifmt={kind}", table, files[kind], check_units=kind != "csv", text_as_latin1=kind != "votable")


def main() -> int:
    directory = Path(sys.argv[1])
    expected = json.loads((directory / "expected.json").read_text(encoding="utf-8"))
    files = expected["files"]
    started = start_stilts(directory, files)
    if "votable" in files:
        check_votable(directory, files["votable"])
    if "csv" in files:
        check_csv(directory, files["csv"])
    if "ecsv" in files:
        check_ecsv(directory, files["ecsv"], expected["provenance"])
    finish_stilts(started, files)
    versions = {"astropy": astropy.__version__, "numpy": np.__version__}
    print(json.dumps({"problems": problems, "versions": versions}, indent=1))
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main())
