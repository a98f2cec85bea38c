/**
 * What the browser receives about a target's notes and their history. Types only, shared by the
 * data-access layer (lib/server/notes.ts) and the notes components.
 */
export interface NoteView {
  id: string;
  targetId: string;
  body: string;
  version: number;
  authorName: string | null;
  updatedByName: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface NoteRevisionView {
  version: number;
  body: string;
  editedByName: string | null;
  editedAt: string;
}
