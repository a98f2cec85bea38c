import type { FieldErrors } from "@/lib/errors";

/** An error answer of the product's API, `{ error: { code, message, fields?, details? } }`. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: FieldErrors = {},
    readonly details: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = "ApiError";
  }
}

/** fetch for the app's JSON API: returns the parsed body, throws ApiError on any error status. */
export async function apiFetch<T>(url: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  const response = await fetch(url, {
    method: init.method ?? "GET",
    headers: init.body === undefined ? undefined : { "content-type": "application/json" },
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
  if (response.status === 204) return undefined as T;
  const payload = await response.json().catch(() => null);
  if (!response.ok) {
    const error = payload?.error;
    throw new ApiError(response.status, error?.code ?? "internal:client", error?.message ?? `Request failed (${response.status}).`, error?.fields, error?.details);
  }
  return payload as T;
}

export const swrFetcher = <T,>(url: string) => apiFetch<T>(url);
