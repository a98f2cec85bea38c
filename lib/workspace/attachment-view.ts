/**
 * What the browser receives about a note's attached file. Types only, shared by the data-access layer
 * (lib/server/attachments.ts) and the attachment components.
 */
import type { AttachmentKind } from "@/lib/imports/attachment-type";
import type { FitsHeader } from "@/lib/imports/fits-header";

export interface AttachmentView {
  id: string;
  noteId: string;
  name: string;
  kind: AttachmentKind;
  sizeBytes: number;
  /** FITS only: the primary header (keywords, BITPIX, axes, header and data sizes). */
  fitsHeader: FitsHeader | null;
  /** The app's own URL for the file; it checks access at every read and sends the bytes itself. */
  fileUrl: string;
  createdAt: string;
}
