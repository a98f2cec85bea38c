import { AppError } from "@/lib/errors";
import { parseFitsHeader, type FitsHeader } from "@/lib/imports/fits-header";
import { formatMebibytes } from "@/lib/imports/import-table";
import { MAX_ATTACHMENT_BYTES } from "@/lib/imports/limits";

export const attachmentKinds = ["png", "jpeg", "pdf", "fits"] as const;
export type AttachmentKind = (typeof attachmentKinds)[number];

/** The media type each kind is stored and served with (FITS: RFC 4047). */
export const attachmentMimeTypes: Record<AttachmentKind, string> = {
  png: "image/png",
  jpeg: "image/jpeg",
  pdf: "application/pdf",
  fits: "application/fits",
};

const startsWith = (bytes: Uint8Array, signature: readonly number[]) => signature.every((byte, i) => bytes[i] === byte);
const ascii = (text: string) => [...text].map((char) => char.charCodeAt(0));

// PNG: the 8-byte signature (PNG Specification, 3rd ed., §5.2). JPEG: the SOI marker FF D8 and the
// next marker's FF (ITU-T T.81 Annex B.1). PDF: "%PDF-" at the start (ISO 32000-1 §7.5.2). FITS:
// "SIMPLE  =" in columns 1–9 of the first card (FITS Standard 4.0 §4.4.1.1).
const signatures: [AttachmentKind, readonly number[]][] = [
  ["png", [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]],
  ["jpeg", [0xff, 0xd8, 0xff]],
  ["pdf", ascii("%PDF-")],
  ["fits", ascii("SIMPLE  =")],
];

/** The kind of file by its first bytes; the name and the declared type play no part. Null if none. */
export function detectAttachmentKind(bytes: Uint8Array): AttachmentKind | null {
  return signatures.find(([, signature]) => startsWith(bytes, signature))?.[0] ?? null;
}

/** How the app serves a stored file: the media type its bytes show, and whether a browser may show it in the page. */
export interface ServedForm {
  mimeType: string;
  /** Only the images the app renders itself (PNG, JPEG); everything else is a download. */
  isInline: boolean;
}

/**
 * The served form of a stored file, read from its first bytes again at every read (the type the
 * uploader declared plays no part): PNG and JPEG inline, PDF and FITS as downloads of their own type,
 * anything else (HTML, SVG, a file swapped behind the app's back) as an opaque download.
 */
export function servedFormOf(head: Uint8Array): ServedForm {
  const kind = detectAttachmentKind(head);
  if (kind === null) return { mimeType: "application/octet-stream", isInline: false };
  return { mimeType: attachmentMimeTypes[kind], isInline: kind === "png" || kind === "jpeg" };
}

/** How many leading bytes `detectAttachmentKind` reads. */
export const SIGNATURE_BYTES = Math.max(...signatures.map(([, signature]) => signature.length));

export interface CheckedAttachment {
  kind: AttachmentKind;
  mimeType: string;
  sizeBytes: number;
  /** For FITS files: every HDU's header, to show its type, keywords and data size. */
  fitsHeader?: FitsHeader;
}

/**
 * Accepts a note attachment by content: PNG, JPEG, PDF or FITS (whose header must also read), not
 * empty, at most MAX_ATTACHMENT_BYTES. Refusals are AppErrors with a message for the user.
 */
export function checkAttachment(bytes: Uint8Array): CheckedAttachment {
  if (bytes.length === 0) throw new AppError("bad_request:attachment", "The file is empty.");
  if (bytes.length > MAX_ATTACHMENT_BYTES) {
    throw new AppError("payload_too_large:attachment", `The file is larger than ${formatMebibytes(MAX_ATTACHMENT_BYTES)}, the limit for an attachment.`);
  }
  const kind = detectAttachmentKind(bytes);
  if (kind === null) throw new AppError("bad_request:attachment", "Attach a PNG or JPEG image, a PDF or a FITS file; this file's content is none of them.");
  const checked: CheckedAttachment = { kind, mimeType: attachmentMimeTypes[kind], sizeBytes: bytes.length };
  return kind === "fits" ? { ...checked, fitsHeader: parseFitsHeader(bytes) } : checked;
}
