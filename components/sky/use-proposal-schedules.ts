"use client";

import type { ObservingSchedule, SchedulesRequest } from "@/lib/schedule";
import type { ScheduleWorkerApi } from "@/workers/schedule.worker";
import { useWorkerAnswer, type WorkerAnswer } from "./use-worker-answer";

const createScheduleWorker = () => new Worker(new URL("../../workers/schedule.worker.ts", import.meta.url), { type: "module", name: "proposal-schedules" });

/**
 * The simulated observing schedules of a proposal's targets (`observingSchedules`, the code the
 * verdicts count), computed in the schedule worker (`workers/schedule.worker.ts`).
 */
export function useProposalSchedules(request: SchedulesRequest | null): WorkerAnswer<ObservingSchedule[]> {
  return useWorkerAnswer<ScheduleWorkerApi, SchedulesRequest, ObservingSchedule[]>(createScheduleWorker, (api, r) => api.schedules(r), request);
}
