"use client";

import type { SeasonRequest, SeasonWindows } from "@/lib/astro/season";
import type { SkyWorkerApi } from "@/workers/sky.worker";
import { useWorkerAnswer, type WorkerAnswer } from "./use-worker-answer";

const createSkyWorker = () => new Worker(new URL("../../workers/sky.worker.ts", import.meta.url), { type: "module" });

/** The sky page's season for `request`, computed in the sky worker (`workers/sky.worker.ts`). */
export function useSeason(request: SeasonRequest | null): WorkerAnswer<SeasonWindows> {
  return useWorkerAnswer<SkyWorkerApi, SeasonRequest, SeasonWindows>(createSkyWorker, (api, r) => api.season(r), request);
}
