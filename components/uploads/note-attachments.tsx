"use client";

import { useState } from "react";
import useSWR from "swr";
import type { AttachmentView } from "@/lib/workspace/attachment-view";
import { apiFetch, swrFetcher } from "@/components/shared/api-client";
import { FormError } from "@/components/shared/field";
import { UploadDropzone, dropzoneAppearance, refusalOf } from "@/components/uploads/dropzone";

const NOTE_URL = /^\/api\/proposals\/([^/]+)\/targets\/([^/]+)\/notes\/([^/]+)$/;

function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

/**
 * A note's attached files: images shown, PDFs linked, FITS files with their primary header's
 * keywords and data size. Co-I and PI attach (through the upload service) and remove.
 */
export function NoteAttachments({ noteUrl, canEdit }: { noteUrl: string; canEdit: boolean }) {
  const url = `${noteUrl}/attachments`;
  const { data, mutate } = useSWR<{ attachments: AttachmentView[] }>(url, swrFetcher);
  const [message, setMessage] = useState<string | null>(null);
  const match = NOTE_URL.exec(noteUrl);
  const attachments = data?.attachments ?? [];
  return (
    <div className="space-y-2" data-testid="note-attachments">
      {attachments.length > 0 && (
        <ul className="space-y-3" aria-label="Attachments">
          {attachments.map((a) => (
            <li key={a.id} className="space-y-1" data-testid="attachment" data-kind={a.kind}>
              <div className="flex items-center gap-3 text-sm">
                <a href={a.fileUrl} target="_blank" rel="noreferrer">
                  {a.name}
                </a>
                <span className="text-dusk-dim">
                  {a.kind.toUpperCase()} · {formatBytes(a.sizeBytes)}
                </span>
                {canEdit && (
                  <button
                    type="button"
                    className="text-alarm"
                    onClick={() => {
                      setMessage(null);
                      apiFetch(`${url}/${a.id}`, { method: "DELETE" })
                        .then(() => mutate())
                        .catch((error: Error) => setMessage(error.message));
                    }}
                  >
                    Remove
                  </button>
                )}
              </div>
              {(a.kind === "png" || a.kind === "jpeg") && (
                // Same origin (CSP img-src 'self'): the app's route checks membership and streams the bytes.
                // eslint-disable-next-line @next/next/no-img-element
                <img src={a.fileUrl} alt={`Attachment ${a.name}`} className="max-h-64 rounded border border-void-edge" />
              )}
              {a.kind === "fits" && a.fitsHeader && (
                <details className="text-sm">
                  <summary>
                    FITS file: {a.fitsHeader.hdus.length} {a.fitsHeader.hdus.length === 1 ? "HDU" : "HDUs"}
                    {a.fitsHeader.hasMoreHdus && " listed; the file has more, which are not listed"}
                    {a.fitsHeader.isTruncated && <span className="text-alarm"> (file shorter than its headers say)</span>}
                  </summary>
                  {a.fitsHeader.hdus.map((hdu, h) => (
                    <div key={h} className="mt-1">
                      <p>
                        HDU {h + 1}: {hdu.type}, BITPIX {hdu.bitpix}, {hdu.axes.length > 0 ? hdu.axes.join(" × ") : "no data"}, data {formatBytes(hdu.dataBytes)}
                      </p>
                      <table className="font-mono text-xs">
                        <tbody>
                          {hdu.keywords.map((k, i) => (
                            <tr key={i}>
                              <td className="pr-3">{k.key}</td>
                              <td className="whitespace-pre-wrap pr-3 text-glint">{k.text === null ? "" : k.isString ? `'${k.text}'` : k.text}</td>
                              <td className="text-dusk-dim">{k.comment}</td>
                            </tr>
                          ))}
                        </tbody>
                      </table>
                      {hdu.omittedCards > 0 && <p className="text-dusk-dim">{hdu.omittedCards} more cards in this header are not shown.</p>}
                    </div>
                  ))}
                </details>
              )}
            </li>
          ))}
        </ul>
      )}
      {canEdit && match && (
        <UploadDropzone
          endpoint="noteAttachment"
          input={{ proposalId: match[1], targetId: match[2], noteId: match[3] }}
          config={{ mode: "auto" }}
          appearance={{ ...dropzoneAppearance, container: `${dropzoneAppearance.container} p-3` }}
          content={{ label: "Attach a PNG, JPEG, PDF or FITS file", allowedContent: "at most 16 MB" }}
          onUploadBegin={() => setMessage(null)}
          onClientUploadComplete={(uploaded) => {
            setMessage(refusalOf(uploaded));
            void mutate();
          }}
          onUploadError={(error) => setMessage(error.message)}
        />
      )}
      <FormError message={message} />
    </div>
  );
}
