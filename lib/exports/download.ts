import { exportStampOf, PROVENANCE_HEADER, provenanceHeaderValue, type Provenance } from "@/lib/exports/provenance";

/** A file-name-safe ASCII slug of a title ("Arcs over the bulge" → "arcs-over-the-bulge"), at most 60 characters. */
export function fileSlug(title: string): string {
  const slug = title
    .normalize("NFKD")
    .replace(/[^\x00-\x7F]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-") // every run is one "-" from here on, so one at each end is all there is to drop
    .replace(/^-|-$/g, "")
    .slice(0, 60)
    .replace(/-$/, "");
  return slug === "" ? "arcwright" : slug;
}

/** Headers of a download: its media type and `Content-Disposition: attachment` with the file name (RFC 6266). */
export function attachmentHeaders(fileName: string, contentType: string): Record<string, string> {
  return {
    "Content-Type": contentType,
    "Content-Disposition": `attachment; filename="${fileName.replace(/["\\]/g, "")}"`,
    "Cache-Control": "private, no-store",
    "X-Content-Type-Options": "nosniff",
  };
}

/**
 * The download of a table file (`<stem>.<extension>`): every format carries the provenance record in
 * the `Arcwright-Provenance` header, and a file that holds nothing but its table (plain CSV) also
 * names its time of export.
 */
export function tableDownload(text: string, { fileStem, file, provenance }: { fileStem: string; file: { extension: string; contentType: string; carriesProvenance: boolean }; provenance: Provenance }): Response {
  const stamp = file.carriesProvenance ? "" : `-${exportStampOf(provenance)}`;
  const headers = { ...attachmentHeaders(`${fileSlug(fileStem)}${stamp}.${file.extension}`, file.contentType), [PROVENANCE_HEADER]: provenanceHeaderValue(provenance) };
  return new Response(text, { headers });
}
