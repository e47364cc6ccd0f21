// The unsaved draft kept in the browser until the server confirms it, and what to do with it on the next load.
import { validateGuideline, type GuidelineDoc } from './document';

export interface StoredDraft {
  /** The server revision the draft was edited on top of. */
  baseRevision: number;
  doc: GuidelineDoc;
  /** When the draft was last written (ms since epoch). */
  savedAt: number;
}

type StorageLike = Pick<Storage, 'getItem' | 'setItem' | 'removeItem'>;

export const draftKey = (brandId: string) => `plumbline:draft:${brandId}`;

/** The stored draft of a brand, or null when there is none or it no longer reads as a valid document. */
export function readDraft(storage: StorageLike | undefined, brandId: string): StoredDraft | null {
  try {
    const raw = storage?.getItem(draftKey(brandId));
    if (!raw) return null;
    const data = JSON.parse(raw) as Partial<StoredDraft>;
    if (typeof data.baseRevision !== 'number' || typeof data.savedAt !== 'number') return null;
    const checked = validateGuideline(data.doc);
    return checked.ok ? { baseRevision: data.baseRevision, doc: checked.doc, savedAt: data.savedAt } : null;
  } catch {
    return null;
  }
}

/** Writes the draft; false when the browser refuses (private mode, full storage). */
export function writeDraft(storage: StorageLike | undefined, brandId: string, draft: StoredDraft): boolean {
  try {
    storage?.setItem(draftKey(brandId), JSON.stringify(draft));
    return Boolean(storage);
  } catch {
    return false;
  }
}

export function clearDraft(storage: StorageLike | undefined, brandId: string): void {
  try {
    storage?.removeItem(draftKey(brandId));
  } catch {
    // Nothing to clear when storage is unavailable.
  }
}

export type RestoreDecision =
  | { kind: 'none' }
  /** Same base as the server: the draft holds unsaved typing on top of it; load it and save it. */
  | { kind: 'restore'; draft: StoredDraft }
  /** The server moved on since the draft was made: the designer chooses. */
  | { kind: 'conflict'; draft: StoredDraft };

/** True when a document holds nothing a person typed: no blocks, or only empty paragraphs. */
export function isBlankDoc(doc: GuidelineDoc): boolean {
  const blocks = (doc.content ?? []) as { type?: string; content?: unknown[] }[];
  return blocks.every((b) => b.type === 'paragraph' && !(b.content && b.content.length));
}

/** Compares a stored draft with what the server sent. */
export function decideRestore(draft: StoredDraft | null, server: { revision: number; doc: unknown }): RestoreDecision {
  if (!draft) return { kind: 'none' };
  if (JSON.stringify(draft.doc) === JSON.stringify(server.doc)) return { kind: 'none' };
  // A blank page kept by the browser has nothing to lose: it must never compete with a saved document (a template, say).
  if (isBlankDoc(draft.doc)) return { kind: 'none' };
  return draft.baseRevision === server.revision ? { kind: 'restore', draft } : { kind: 'conflict', draft };
}
