#!/usr/bin/python3
"""Reads the data behind each figure with the tools astronomers trust and reports every loss.

Usage: /usr/bin/python3 tests/validators/check_figure_data.py DIR

DIR holds the files and `expected.json`, written by tests/integration/exports-figure-data.test.ts:
  {"tables": [{"name", "files": {"csv"|"ecsv"|"votable": path},
    "columns": [{"name", "header", "unit", "ucd", "description"}],
    "rows": [[number | string | null, ...]], "csvRows": [...], "provenance": {...}}]}
`unit` is the column's VOUnit, or null for none; `header` is the CSV header of the column.
Each file is read with astropy (Debian's python3-astropy: `Table.read` in its format, the VOTable
parsed with verify='exception' so that any warning is a failure), written back by astropy and read
again. Every file is also read by STILTS (Debian's stilts): one `stilts tmultin` reads them all into
one multi-table VOTable (one JVM instead of one per file), which is then compared table by table.
Every row must be there, numbers equal to 1e-9 relative, units (VOTable, ECSV, STILTS's reading of
them) the declared VOUnit, UCDs the declared ones and words of the UCD1+ vocabulary (astropy's
`check_ucd`), ECSV descriptions the declared ones and the ECSV meta the provenance record.

Prints a JSON report {"problems": [...], "versions": {...}, "rows": N} and exits 1 on a problem.
"""
import io
import json
import subprocess
import sys
import warnings
from pathlib import Path

import astropy
import numpy as np
from astropy.io.votable import parse as parse_votable
from astropy.io.votable.ucd import check_ucd
from astropy.table import Table

# The cell reading and the comparisons (1e-9 relative, units as VOUnit) of the target table check.
sys.path.insert(0, str(Path(__file__).resolve().parent))
from check_tables import cell, same_unit, same_value  # noqa: E402

# Each is also the name STILTS gives the format (`ifmt`).
FORMATS = ("csv", "ecsv", "votable")

problems: list[str] = []


def as_latin1(text: str) -> str:
    """The UTF-8 bytes of a text read one character per byte, as STILTS's CSV and ECSV readers read them."""
    return text.encode("utf-8").decode("latin-1")


def compare(label: str, table: Table, spec: dict, name_key: str, check_units: bool, latin1: bool = False) -> None:
    """Columns in order with the expected names, every row, every value, and (when asked) each unit.

    The CSV is compared with `csvRows` (its text cells as the formula guard writes them) and its header
    names; every other reading with `rows` and the machine names.
    """
    rows = spec["csvRows"] if name_key == "header" else spec["rows"]
    if len(table) != len(rows):
        problems.append(f"{label}: {len(table)} rows, expected {len(rows)}")
        return
    if len(table.colnames) != len(spec["columns"]):
        problems.append(f"{label}: columns {table.colnames}, expected {[c[name_key] for c in spec['columns']]}")
        return
    for index, column_spec in enumerate(spec["columns"]):
        column = table.columns[index]
        name = as_latin1(column_spec[name_key]) if latin1 else column_spec[name_key]
        if column.name != name:
            problems.append(f"{label}: column {index + 1} is named {column.name!r}, expected {name!r}")
        if check_units and not same_unit(column.unit, column_spec["unit"]):
            problems.append(f"{label}: column {name!r} has unit {column.unit!s}, expected {column_spec['unit']}")
        mismatches = 0
        for row, values in enumerate(rows):
            expected = values[index]
            if latin1 and isinstance(expected, str):
                expected = as_latin1(expected)
            actual = cell(column, row)
            if not same_value(actual, expected):
                mismatches += 1
                if mismatches <= 3:
                    problems.append(f"{label}: row {row + 1} column {name!r} reads {actual!r}, expected {values[index]!r}")
        if mismatches > 3:
            problems.append(f"{label}: column {name!r}: {mismatches} values differ in all")


def check_ucds(label: str, declared: list[str], spec: dict) -> None:
    for column_spec, ucd in zip(spec["columns"], declared):
        if ucd != column_spec["ucd"]:
            problems.append(f"{label}: column {column_spec['name']!r} has UCD {ucd!r}, expected {column_spec['ucd']!r}")
        if not check_ucd(column_spec["ucd"], check_controlled_vocabulary=True):
            problems.append(f"{label}: column {column_spec['name']!r}: {column_spec['ucd']!r} is not a valid UCD1+")


def check_votable(directory: Path, spec: dict) -> None:
    label = f"{spec['name']}: astropy VOTable"
    try:
        document = parse_votable(str(directory / spec["files"]["votable"]), verify="exception")
    except Exception as error:  # every astropy warning is an error here
        problems.append(f"{label} parse: {error}")
        return
    votable = document.get_first_table()
    check_ucds(label, [field.ucd for field in votable.fields], spec)
    compare(label, votable.to_table(use_names_over_ids=True), spec, "name", check_units=True)
    rewritten = io.BytesIO()
    document.to_xml(rewritten)
    rewritten.seek(0)
    reread = parse_votable(rewritten, verify="exception").get_first_table().to_table(use_names_over_ids=True)
    compare(f"{label} rewrite", reread, spec, "name", check_units=True)


def check_ecsv(directory: Path, spec: dict) -> None:
    label = f"{spec['name']}: astropy ECSV"
    try:
        with warnings.catch_warnings():
            warnings.simplefilter("error")
            table = Table.read(str(directory / spec["files"]["ecsv"]), format="ascii.ecsv")
    except Exception as error:
        problems.append(f"{label} read: {error}")
        return
    rewritten = io.StringIO()
    table.write(rewritten, format="ascii.ecsv")
    for candidate_label, candidate in [(label, table), (f"{label} rewrite", Table.read(rewritten.getvalue(), format="ascii.ecsv"))]:
        compare(candidate_label, candidate, spec, "name", check_units=True)
        check_ucds(candidate_label, [candidate[c["name"]].meta.get("ucd") if c["name"] in candidate.colnames else None for c in spec["columns"]], spec)
        for column_spec in spec["columns"]:
            name = column_spec["name"]
            if name in candidate.colnames and candidate[name].description != column_spec["description"]:
                problems.append(f"{candidate_label}: column {name!r} described as {candidate[name].description!r}")
        if json.loads(json.dumps(dict(candidate.meta), default=str)) != spec["provenance"]:
            problems.append(f"{candidate_label}: meta is {dict(candidate.meta)!r}, expected the provenance record")


def check_csv(directory: Path, spec: dict) -> None:
    label = f"{spec['name']}: astropy CSV"
    try:
        table = Table.read(str(directory / spec["files"]["csv"]), format="ascii.csv")
    except Exception as error:
        problems.append(f"{label} read: {error}")
        return
    compare(label, table, spec, "header", check_units=False)
    rewritten = io.StringIO()
    table.write(rewritten, format="ascii.csv")
    compare(f"{label} rewrite", Table.read(rewritten.getvalue(), format="ascii.csv"), spec, "header", check_units=False)


def start_stilts(directory: Path, tables: list[dict]) -> tuple[subprocess.Popen, Path, list[tuple[dict, str]]]:
    """One `stilts tmultin` reading every file into one VOTable, started before the astropy checks so its JVM runs beside them."""
    inputs = [(spec, kind) for spec in tables for kind in FORMATS if kind in spec["files"]]
    out = directory / "all-by-stilts.vot"
    command = ["stilts", "tmultin", f"nin={len(inputs)}", "ofmt=votable", f"out={out}"]
    for number, (spec, kind) in enumerate(inputs, start=1):
        command += [f"in{number}={directory / spec['files'][kind]}", f"ifmt{number}={kind}"]
    process = subprocess.Popen(command, stdout=subprocess.PIPE, stderr=subprocess.STDOUT, text=True)
    return process, out, inputs


def finish_stilts(process: subprocess.Popen, out: Path, inputs: list[tuple[dict, str]]) -> None:
    output, _ = process.communicate(timeout=120)
    if process.returncode != 0:
        problems.append(f"stilts tmultin: {output.strip()}")
        return
    # STILTS's own VOTable, read leniently: its warnings (such as its unit "iso" for ISO 8601 text) are about STILTS's file, not ours.
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        resources = list(parse_votable(str(out), verify="ignore").iter_tables())
    for (spec, kind), votable in zip(inputs, resources):
        label = f"{spec['name']}: stilts ifmt={kind}"
        table = votable.to_table(use_names_over_ids=True)
        # STILTS 3.4's CSV and ECSV readers take each byte for one character (module doc of check_tables.py).
        compare(label, table, spec, "header" if kind == "csv" else "name", check_units=kind != "csv", latin1=kind != "votable")


def main() -> int:
    directory = Path(sys.argv[1])
    tables = json.loads((directory / "expected.json").read_text(encoding="utf-8"))["tables"]
    process, out, inputs = start_stilts(directory, tables)
    for spec in tables:
        if "votable" in spec["files"]:
            check_votable(directory, spec)
        if "ecsv" in spec["files"]:
            check_ecsv(directory, spec)
        if "csv" in spec["files"]:
            check_csv(directory, spec)
    finish_stilts(process, out, inputs)
    versions = {"astropy": astropy.__version__, "numpy": np.__version__}
    print(json.dumps({"problems": problems, "versions": versions, "rows": sum(len(spec["rows"]) for spec in tables)}, indent=1))
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main())
