/** Loads the JSON fixtures written by tests/fixtures/generate_astro.py (astropy, IERS download off). */
import { readFileSync } from "node:fs";
import { join } from "node:path";
import type { SkySiteInput, SkyTarget } from "@/lib/astro/inputs";

export interface AstroFixture {
  versions: Record<string, string>;
  iers: string;
  sites: Record<string, SkySiteInput>;
  targets: Record<string, SkyTarget>;
}

export function loadAstroFixture<T>(name: string): AstroFixture & T {
  return JSON.parse(readFileSync(join(process.cwd(), "tests", "fixtures", "astro", name), "utf8"));
}

/** Minutes between two Julian dates. */
export function minutesBetween(a: number, b: number): number {
  return Math.abs(a - b) * 1440;
}
