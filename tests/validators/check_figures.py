#!/usr/bin/python3
"""Checks the figure exports with the tools from Debian that astronomers' pipelines trust.

Usage: /usr/bin/python3 tests/validators/check_figures.py DIR

DIR holds the exports and `expected.json`, written by tests/integration/exports-figures.test.ts:
  {"pdf": [{"path", "texts": [str, ...], "author": str | null}], "png": [{"path", "dpi": int}]}
Each PDF is checked by
  - `qpdf --check` (Debian's qpdf): the file's structure and streams are sound;
  - `pdffonts` (poppler-utils): every font is embedded ("emb" yes) and has a ToUnicode map ("uni");
  - `pdftotext` (poppler-utils): each expected text (e.g. a target named "Śrī Ωmega−1") is extracted
    intact; a link wrapped onto caption lines is looked for with the line breaks removed;
  - `pdfinfo` (poppler-utils): Author is the exporter (absent when nobody signed in), Creator and
    Producer name the software.
Each PNG is checked by `pngcheck -v` (Debian's pngcheck): no error, and a pHYs chunk with the DPI
expected (pixels per metre, unit metre).

Prints a JSON report {"problems": [...], "checked": {...}} and exits 1 when there is a problem.
"""
import json
import re
import subprocess
import sys
from pathlib import Path

problems: list[str] = []
checked: dict[str, dict] = {}


def run(*command: str) -> subprocess.CompletedProcess:
    return subprocess.run(command, capture_output=True, text=True, check=False)


def check_pdf(entry: dict) -> None:
    path = entry["path"]
    name = Path(path).name
    report: dict = {}

    # qpdf --check: exit 0 and "No syntax or stream encoding errors found".
    qpdf = run("qpdf", "--check", path)
    report["qpdf"] = qpdf.returncode
    if qpdf.returncode != 0 or "No syntax or stream encoding errors" not in qpdf.stdout:
        problems.append(f"{name}: qpdf --check failed: {qpdf.stdout.strip()[-300:]} {qpdf.stderr.strip()[-300:]}")

    # pdffonts: columns name, type, encoding, emb, sub, uni, object ID; every row emb = yes, uni = yes.
    fonts = run("pdffonts", path)
    rows = [line.split() for line in fonts.stdout.splitlines()[2:] if line.strip()]
    report["fonts"] = [{"name": row[0], "emb": row[-5], "uni": row[-3]} for row in rows]
    if fonts.returncode != 0:
        problems.append(f"{name}: pdffonts failed: {fonts.stderr.strip()}")
    for font in report["fonts"]:
        if font["emb"] != "yes":
            problems.append(f"{name}: pdffonts: font {font['name']} is not embedded")
        if font["uni"] != "yes":
            problems.append(f"{name}: pdffonts: font {font['name']} has no ToUnicode map")

    # pdftotext: the expected texts, as extracted (UTF-8).
    text = run("pdftotext", "-enc", "UTF-8", path, "-").stdout
    squashed = re.sub(r"\s+", "", text)
    report["textChars"] = len(text)
    for expected in entry.get("texts", []):
        if expected not in text:
            problems.append(f"{name}: pdftotext does not extract {expected!r}")
    for link in entry.get("links", []):
        if re.sub(r"\s+", "", link) not in squashed:
            problems.append(f"{name}: pdftotext does not extract the whole link {link!r}")

    # pdfinfo: Author, Creator, Producer of the info dictionary.
    info = dict(
        (key.strip(), value.strip())
        for key, _, value in (line.partition(":") for line in run("pdfinfo", "-enc", "UTF-8", path).stdout.splitlines())
    )
    report["info"] = {key: info.get(key) for key in ("Author", "Creator", "Producer")}
    if info.get("Author") != entry.get("author"):
        problems.append(f"{name}: pdfinfo Author is {info.get('Author')!r}, expected {entry.get('author')!r}")
    for key in ("Creator", "Producer"):
        if not (info.get(key) or "").startswith(entry["software"]):
            problems.append(f"{name}: pdfinfo {key} is {info.get(key)!r}, expected it to name {entry['software']!r}")
    checked[name] = report


def check_png(entry: dict) -> None:
    path = entry["path"]
    name = Path(path).name
    result = run("pngcheck", "-v", path)
    report: dict = {"pngcheck": result.returncode}
    if result.returncode != 0 or "No errors detected" not in result.stdout:
        problems.append(f"{name}: pngcheck failed: {result.stdout.strip()[-400:]}")
    # pngcheck -v prints "chunk pHYs at offset …, length 9: 11811x11811 pixels/meter (300 dpi)".
    phys = re.search(r"chunk pHYs [^\n]*?(\d+)x(\d+) pixels/meter[^\n]*", result.stdout)
    report["pHYs"] = phys.group(0).strip() if phys else None
    if phys is None:
        problems.append(f"{name}: pngcheck finds no pHYs chunk (no DPI)")
    else:
        expected = round(entry["dpi"] / 0.0254)
        if int(phys.group(1)) != expected or int(phys.group(2)) != expected:
            problems.append(f"{name}: pHYs is {phys.group(1)}x{phys.group(2)} px/m, expected {expected} ({entry['dpi']} dpi)")
    checked[name] = report


def main() -> int:
    directory = Path(sys.argv[1])
    expected = json.loads((directory / "expected.json").read_text(encoding="utf-8"))
    for entry in expected.get("pdf", []):
        check_pdf(entry)
    for entry in expected.get("png", []):
        check_png(entry)
    print(json.dumps({"problems": problems, "checked": checked}, ensure_ascii=False, indent=1))
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main())
