"use client";

import { useState } from "react";
import useSWR from "swr";
import type { NoteView } from "@/lib/workspace/note-view";
import { ApiError, apiFetch, swrFetcher } from "@/components/shared/api-client";
import { FormError, buttonClass, quietButtonClass } from "@/components/shared/field";
import { formatDateTime } from "@/components/shared/format";
import { Markdown } from "@/components/notes/markdown";
import { useFormSubmit } from "@/components/shared/use-form-submit";
import { NoteAttachments } from "@/components/uploads/note-attachments";

interface TargetNotesProps {
  notesUrl: string;
  initialNotes: NoteView[];
  canEdit: boolean;
}

const textareaClass = "w-full rounded-md border border-void-edge bg-void px-3 py-2 font-mono text-sm";

/** Observation notes of one target: Markdown, rendered sanitized, with edit history and merge on conflict. */
export function TargetNotes({ notesUrl, initialNotes, canEdit }: TargetNotesProps) {
  const { data, mutate } = useSWR<{ notes: NoteView[] }>(notesUrl, swrFetcher, { fallbackData: { notes: initialNotes } });
  const notes = data?.notes ?? [];
  const add = useFormSubmit();
  const [draft, setDraft] = useState("");

  return (
    <section aria-labelledby="notes-heading" className="space-y-4">
      <h2 id="notes-heading" className="text-2xl font-semibold">
        Observation notes
      </h2>
      {notes.length === 0 && <p className="text-dusk-dim">No notes yet.</p>}
      <ol className="space-y-4">
        {notes.map((note) => (
          <li key={note.id}>
            <NoteCard note={note} noteUrl={`${notesUrl}/${note.id}`} canEdit={canEdit} onSaved={() => void mutate()} />
          </li>
        ))}
      </ol>
      {canEdit && (
        <form
          aria-label="Add a note"
          className="space-y-2"
          onSubmit={(event) => {
            event.preventDefault();
            void add.run(async () => {
              await apiFetch(notesUrl, { method: "POST", body: { body: draft } });
              setDraft("");
              await mutate();
            });
          }}
        >
          <label className="block text-sm font-semibold">
            New note (Markdown)
            <textarea value={draft} onChange={(e) => setDraft(e.target.value)} rows={4} className={`mt-1 ${textareaClass}`} />
          </label>
          <FormError message={add.message} />
          <button type="submit" className={buttonClass} disabled={add.isBusy}>
            Add note
          </button>
        </form>
      )}
    </section>
  );
}

interface Conflict {
  mine: string;
  theirs: NoteView;
}

function NoteCard({ note, noteUrl, canEdit, onSaved }: { note: NoteView; noteUrl: string; canEdit: boolean; onSaved: () => void }) {
  const [editing, setEditing] = useState<{ body: string; version: number } | null>(null);
  const [conflict, setConflict] = useState<Conflict | null>(null);
  const [showHistory, setShowHistory] = useState(false);
  const save = useFormSubmit();

  function submit(body: string, version: number) {
    void save.run(async () => {
      try {
        await apiFetch(noteUrl, { method: "PATCH", body: { body, version } });
        setEditing(null);
        setConflict(null);
        onSaved();
      } catch (error) {
        const current = error instanceof ApiError && error.status === 409 ? (error.details.current as NoteView | undefined) : undefined;
        if (!current) throw error;
        // Keep both texts: the editor now starts from the saved version, with the user's text to merge.
        setConflict({ mine: body, theirs: current });
        setEditing({ body: `${current.body}\n\n${body}`, version: current.version });
        throw error;
      }
    });
  }

  return (
    <article className="space-y-2 rounded-lg border border-void-edge bg-void-raised p-4" data-testid="note">
      <p className="text-xs text-dusk-dim">
        {note.authorName ?? "A former member"} · {formatDateTime(note.createdAt)}
        {note.version > 1 && ` · edited by ${note.updatedByName ?? "a former member"} ${formatDateTime(note.updatedAt)} (version ${note.version})`}
      </p>
      {editing ? (
        <form
          aria-label="Edit note"
          className="space-y-2"
          onSubmit={(event) => {
            event.preventDefault();
            submit(editing.body, editing.version);
          }}
        >
          {conflict && (
            <div className="grid gap-3 md:grid-cols-2" data-testid="note-conflict">
              <div>
                <h3 className="text-sm font-semibold">Saved meanwhile by {conflict.theirs.updatedByName ?? "someone"}</h3>
                <pre className="whitespace-pre-wrap rounded border border-void-edge p-2 text-sm">{conflict.theirs.body}</pre>
              </div>
              <div>
                <h3 className="text-sm font-semibold">Your text</h3>
                <pre className="whitespace-pre-wrap rounded border border-void-edge p-2 text-sm">{conflict.mine}</pre>
              </div>
            </div>
          )}
          <label className="block text-sm font-semibold">
            {conflict ? "Merged text" : "Note text (Markdown)"}
            <textarea value={editing.body} onChange={(e) => setEditing({ ...editing, body: e.target.value })} rows={6} className={`mt-1 ${textareaClass}`} />
          </label>
          <FormError message={save.message} />
          <div className="flex gap-3">
            <button type="submit" className={buttonClass} disabled={save.isBusy}>
              Save note
            </button>
            <button type="button" className={quietButtonClass} onClick={() => (setEditing(null), setConflict(null))}>
              Cancel
            </button>
          </div>
        </form>
      ) : (
        <Markdown source={note.body} />
      )}
      <div className="flex gap-3 text-sm">
        {canEdit && !editing && (
          <button type="button" className="text-glint" onClick={() => setEditing({ body: note.body, version: note.version })}>
            Edit
          </button>
        )}
        {note.version > 1 && (
          <button type="button" className="text-dusk-dim" onClick={() => setShowHistory((v) => !v)} aria-expanded={showHistory}>
            History
          </button>
        )}
      </div>
      {showHistory && <NoteHistory noteUrl={noteUrl} />}
      <NoteAttachments noteUrl={noteUrl} canEdit={canEdit} />
    </article>
  );
}

function NoteHistory({ noteUrl }: { noteUrl: string }) {
  const { data } = useSWR<{ revisions: { version: number; body: string; editedByName: string | null; editedAt: string }[] }>(noteUrl, swrFetcher);
  return (
    <ol className="space-y-2 border-l border-void-edge pl-3 text-sm" aria-label="Earlier versions">
      {data?.revisions.map((r) => (
        <li key={r.version}>
          <p className="text-xs text-dusk-dim">
            Version {r.version} · {r.editedByName ?? "a former member"} · {formatDateTime(r.editedAt)}
          </p>
          <pre className="whitespace-pre-wrap">{r.body}</pre>
        </li>
      ))}
    </ol>
  );
}
