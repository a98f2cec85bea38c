/** Loads the JSON fixture written by tests/fixtures/generate_psf.py. */
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";

const FIXTURE_PATH = fileURLToPath(new URL("../../fixtures/photometry/psf.json", import.meta.url));

export function loadPhotometryFixture<T>(): T & { versions: Record<string, string> } {
  return JSON.parse(readFileSync(FIXTURE_PATH, "utf8"));
}

export { relativeError } from "../physics/fixtures";
