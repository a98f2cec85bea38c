"use client";

import { useEffect, useRef, useState } from "react";
import { wrap, type Remote } from "comlink";

/** A worker's answer to the latest request: the previous answer stays on hand while a newer one computes. */
export type WorkerAnswer<T> =
  | { status: "idle" | "computing"; value: T | null; error: null }
  | { status: "done"; value: T; error: null }
  | { status: "failed"; value: null; error: string };

/**
 * The answer of `ask` to `request`, computed in one web worker made by `createWorker` (on first use,
 * ended with the component). A newer request supersedes an older one: a stale answer is dropped,
 * never shown. `null` computes nothing. Requests are compared by value (JSON).
 */
export function useWorkerAnswer<Api, Request, T>(
  createWorker: () => Worker,
  ask: (api: Remote<Api>, request: Request) => Promise<T>,
  request: Request | null,
): WorkerAnswer<T> {
  const workerRef = useRef<{ worker: Worker; api: Remote<Api> } | null>(null);
  const generation = useRef(0);
  const [state, setState] = useState<WorkerAnswer<T>>({ status: "idle", value: null, error: null });
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
      const worker = createWorker();
      workerRef.current = { worker, api: wrap<Api>(worker) };
    }
    const mine = ++generation.current;
    setState((previous) => ({ status: "computing", value: previous.value, error: null }));
    ask(workerRef.current.api, request).then(
      (value) => {
        if (mine === generation.current) setState({ status: "done", value, error: null });
      },
      (error: unknown) => {
        if (mine === generation.current) setState({ status: "failed", value: null, error: error instanceof Error ? error.message : String(error) });
      },
    );
    // The request is compared by value through `key`; the worker and the question are fixed per hook.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);

  return state;
}
