/** Loads a JSON fixture written by tests/fixtures/generate_photometry.py (moon-sky.json, ccd.json, visit-budget.json). */
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";

const FIXTURE_DIR = fileURLToPath(new URL("../../fixtures/photometry/", import.meta.url));

export function loadBudgetFixture<T>(name: "moon-sky.json" | "ccd.json" | "visit-budget.json"): T & { versions: Record<string, string> } {
  return JSON.parse(readFileSync(`${FIXTURE_DIR}${name}`, "utf8"));
}
