/** Loads the JSON fixtures written by tests/fixtures/generate_physics.py. */
import { readFileSync } from "node:fs";
import { join } from "node:path";

const FIXTURE_DIR = join(process.cwd(), "tests", "fixtures", "physics");

export function loadFixture<T>(name: string): T & { versions: Record<string, string> } {
  return JSON.parse(readFileSync(join(FIXTURE_DIR, name), "utf8"));
}

/** |actual - expected| / |expected| (absolute when expected is 0). */
export function relativeError(actual: number, expected: number): number {
  return expected === 0 ? Math.abs(actual) : Math.abs(actual - expected) / Math.abs(expected);
}
