/// <reference lib="webworker" />
// The lens bench's observing schedule off the main thread: a thin comlink wrapper around the same
// `targetSchedules` the server runs for stored targets (lib/bench/case-report.ts).
import { expose, transfer } from "comlink";
import { benchSchedule, type BenchScheduleRequest } from "@/lib/bench/case-report";
import type { ObservingSchedule } from "@/lib/schedule";

const api = {
  /** Same contract as `benchSchedule`; the per-night and per-visit arrays come back as transferred buffers. */
  schedule(request: BenchScheduleRequest): ObservingSchedule {
    const schedule = benchSchedule(request);
    return transfer(schedule, [schedule.visitsJdUtc.buffer, schedule.usableHoursPerNight.buffer, schedule.weeklyUsableHours.buffer] as ArrayBuffer[]);
  },
};

export type ScheduleWorkerApi = typeof api;

expose(api);
