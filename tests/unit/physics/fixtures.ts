/** Loads the JSON fixtures written by tests/fixtures/generate_physics.py. */
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";

const FIXTURE_DIR = fileURLToPath(new URL("../../fixtures/physics/", import.meta.url));

export function loadFixture<T>(name: string): T & { versions: Record<string, string> } {
  return JSON.parse(readFileSync(`${FIXTURE_DIR}${name}`, "utf8"));
}

/** |actual - expected| / |expected| (absolute when expected is 0). */
export function relativeError(actual: number, expected: number): number {
  return expected === 0 ? Math.abs(actual) : Math.abs(actual - expected) / Math.abs(expected);
}
