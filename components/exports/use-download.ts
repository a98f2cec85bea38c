"use client";

import { useState } from "react";

/** The file name a response's Content-Disposition gives, else `fallback`. */
function fileNameOf(response: Response, fallback: string): string {
  return /filename="([^"]+)"/.exec(response.headers.get("content-disposition") ?? "")?.[1] ?? fallback;
}

/**
 * Fetches an export and hands it to the browser as a download; a refused request keeps the server's
 * message (which names the field) for the UI to show instead of saving an error as a file.
 */
export function useDownload() {
  const [error, setError] = useState<string | null>(null);
  const [isBusy, setIsBusy] = useState(false);
  async function download(url: string, fallbackName: string) {
    setIsBusy(true);
    setError(null);
    try {
      const response = await fetch(url);
      if (!response.ok) {
        const body = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
        setError(body?.error?.message ?? `The export failed (HTTP ${response.status}).`);
        return;
      }
      const objectUrl = URL.createObjectURL(await response.blob());
      const anchor = document.createElement("a");
      anchor.href = objectUrl;
      anchor.download = fileNameOf(response, fallbackName);
      document.body.append(anchor);
      anchor.click();
      anchor.remove();
      setTimeout(() => URL.revokeObjectURL(objectUrl), 10_000);
    } catch {
      setError("The export could not be fetched; check the connection and try again.");
    } finally {
      setIsBusy(false);
    }
  }
  return { download, error, isBusy };
}
