"use client";

import { generateUploadDropzone } from "@uploadthing/react";
import type { UploadRouter } from "@/lib/workspace/upload-view";

/** The SDK's dropzone, typed by the app's upload routes (the route config is fetched from /api/uploadthing). */
export const UploadDropzone = generateUploadDropzone<UploadRouter>();

/** Night-palette classes for the SDK's dropzone parts (the SDK's own Tailwind theme is not loaded). */
export const dropzoneAppearance = {
  container: "flex flex-col items-center gap-2 rounded-lg border border-dashed border-void-edge bg-void-raised p-6 text-center",
  uploadIcon: "hidden",
  label: "text-sm text-dusk",
  allowedContent: "text-xs text-dusk-dim",
  button: "rounded-md bg-ember px-4 py-2 text-sm font-semibold text-void disabled:opacity-60",
} as const;

/** The message of a completion step that refused the file, or null when it was recorded. */
export function refusalOf(result: { serverData: { ok: true; fileId: string } | { ok: false; message: string } }[] | undefined): string | null {
  const outcome = result?.[0]?.serverData;
  if (!outcome) return "The upload did not finish; try again.";
  return outcome.ok ? null : outcome.message;
}
