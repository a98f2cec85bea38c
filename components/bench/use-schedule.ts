"use client";

import { useEffect, useRef, useState } from "react";
import { wrap, type Remote } from "comlink";
import type { BenchSchedule, BenchScheduleRequest } from "@/lib/bench/case-report";
import type { ScheduleWorkerApi } from "@/workers/schedule.worker";

// One object each, so a memo keyed on the schedule does not recompute on every render.
const NONE: BenchSchedule = { status: "none" };
const COMPUTING: BenchSchedule = { status: "computing" };

/**
 * The sketch's observing schedule, simulated in one web worker (`workers/schedule.worker.ts`). A newer
 * request supersedes an older one: a stale answer is dropped, never shown. `null` (no cycle) is "none".
 */
export function useSchedule(request: BenchScheduleRequest | null): BenchSchedule {
  const workerRef = useRef<{ worker: Worker; api: Remote<ScheduleWorkerApi> } | null>(null);
  const generation = useRef(0);
  const key = request === null ? "" : JSON.stringify(request);
  const [state, setState] = useState<{ key: string; schedule: BenchSchedule }>({ key: "", schedule: NONE });

  useEffect(() => {
    return () => {
      workerRef.current?.worker.terminate();
      workerRef.current = null;
    };
  }, []);

  useEffect(() => {
    const mine = ++generation.current;
    if (request === null) return;
    if (workerRef.current === null) {
      const worker = new Worker(new URL("../../workers/schedule.worker.ts", import.meta.url), { type: "module", name: "bench-schedule" });
      workerRef.current = { worker, api: wrap<ScheduleWorkerApi>(worker) };
    }
    workerRef.current.api.schedule(request).then(
      (schedule) => {
        if (mine === generation.current) setState({ key, schedule: { status: "done", schedule } });
      },
      (error: unknown) => {
        if (mine === generation.current) setState({ key, schedule: { status: "failed", message: error instanceof Error ? error.message : String(error) } });
      },
    );
    // The request is compared by value through `key`.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);

  if (request === null) return NONE;
  // Until this request's answer arrives, the schedule on hand is another sketch's.
  return state.key === key ? state.schedule : COMPUTING;
}
