/// <reference lib="webworker" />
// Season computations off the main thread: a thin comlink wrapper around lib/astro/season.
import { expose, transfer } from "comlink";
import { seasonWindows, type SeasonRequest, type SeasonWindows } from "@/lib/astro/season";

const api = {
  /** Same contract as `seasonWindows`; per-night arrays come back as transferred buffers. */
  season(request: SeasonRequest): SeasonWindows {
    const season = seasonWindows(request);
    const buffers = [season.hoursDarkPerNight.buffer, season.moonIlluminatedFractionPerNight.buffer];
    for (const target of season.targets) buffers.push(target.hoursDarkPerNight.buffer, target.tooCloseToSunPerNight.buffer, target.weeklyHoursDark.buffer);
    return transfer(season, buffers as ArrayBuffer[]);
  },
};

export type SkyWorkerApi = typeof api;

expose(api);
