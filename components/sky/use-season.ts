"use client";

import { useEffect, useRef, useState } from "react";
import { wrap, type Remote } from "comlink";
import type { SeasonRequest, SeasonWindows } from "@/lib/astro/season";
import type { SkyWorkerApi } from "@/workers/sky.worker";

type SeasonState =
  | { status: "idle" | "computing"; season: SeasonWindows | null; error: null }
  | { status: "done"; season: SeasonWindows; error: null }
  | { status: "failed"; season: null; error: string };

/**
 * The season for `request`, computed in one web worker (`workers/sky.worker.ts`). A newer request
 * supersedes an older one: a stale answer is dropped, never shown. `null` computes nothing.
 */
export function useSeason(request: SeasonRequest | null): SeasonState {
  const workerRef = useRef<{ worker: Worker; api: Remote<SkyWorkerApi> } | null>(null);
  const generation = useRef(0);
  const [state, setState] = useState<SeasonState>({ status: "idle", season: null, error: null });
  const key = request === null ? "" : JSON.stringify(request);

  useEffect(() => {
    return () => {
      workerRef.current?.worker.terminate();
      workerRef.current = null;
    };
  }, []);

  useEffect(() => {
    if (request === null) return;
    if (workerRef.current === null) {
      const worker = new Worker(new URL("../../workers/sky.worker.ts", import.meta.url), { type: "module" });
      workerRef.current = { worker, api: wrap<SkyWorkerApi>(worker) };
    }
    const mine = ++generation.current;
    setState((previous) => ({ status: "computing", season: previous.season, error: null }));
    workerRef.current.api.season(request).then(
      (season) => {
        if (mine === generation.current) setState({ status: "done", season, error: null });
      },
      (error: unknown) => {
        if (mine === generation.current) setState({ status: "failed", season: null, error: error instanceof Error ? error.message : String(error) });
      },
    );
    // The request is compared by value through `key`.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);

  return state;
}
