/// <reference lib="webworker" />
// Observing schedules off the main thread: a thin comlink wrapper around the same code the server
// runs for stored targets (`targetSchedules` via lib/bench/case-report.ts; `observingSchedules`).
import { expose, transfer } from "comlink";
import { benchSchedule, type BenchScheduleRequest } from "@/lib/bench/case-report";
import { observingSchedules, type ObservingSchedule, type SchedulesRequest } from "@/lib/schedule";

const buffersOf = (schedule: ObservingSchedule) => [schedule.visitsJdUtc.buffer, schedule.usableHoursPerNight.buffer, schedule.weeklyUsableHours.buffer] as ArrayBuffer[];

const api = {
  /** Same contract as `benchSchedule`; the per-night and per-visit arrays come back as transferred buffers. */
  schedule(request: BenchScheduleRequest): ObservingSchedule {
    const schedule = benchSchedule(request);
    return transfer(schedule, buffersOf(schedule));
  },
  /** Same contract as `observingSchedules` (a proposal's season view); arrays transferred as above. */
  schedules(request: SchedulesRequest): ObservingSchedule[] {
    const schedules = observingSchedules(request);
    return transfer(schedules, schedules.flatMap(buffersOf));
  },
};

export type ScheduleWorkerApi = typeof api;

expose(api);
