// Autosave: debounced PUT with the base revision, the unsaved doc kept in localStorage until the server confirms,
// and a conflict the designer resolves (keep theirs or take the server's). Status: saved/pending/saving/offline/conflict/error.
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { ApiClientError, api } from '@/lib/client/api';
import { formatTime } from '@/lib/format';
import { validateGuideline, type GuidelineDoc } from '@/lib/guideline/document';
import { clearDraft, decideRestore, readDraft, writeDraft } from '@/lib/guideline/draft';
import { summarize, type DocSummary } from '@/lib/guideline/outline';

export type SaveStatus = 'saved' | 'pending' | 'saving' | 'offline' | 'conflict' | 'error';

export interface SaveConflict {
  mine: DocSummary;
  theirs: { revision: number; summary: DocSummary | null };
}

export interface SaveState {
  status: SaveStatus;
  revision: number;
  message: string | null;
  /** The first bad path when the server (or our own check) refused the document. */
  path: string | null;
  savedAt: number | null;
  conflict: SaveConflict | null;
}

export interface AutosaveOptions {
  brandId: string;
  initialRevision: number;
  initialDoc: unknown;
  delayMs?: number;
}

const RETRY_MS = 10_000;
const storage = () => (typeof window === 'undefined' ? undefined : window.localStorage);
const guidelinePath = (brandId: string) => `/api/brands/${encodeURIComponent(brandId)}/guideline`;

export function useAutosave({ brandId, initialRevision, initialDoc, delayMs = 800 }: AutosaveOptions) {
  const [state, setState] = useState<SaveState>({ status: 'saved', revision: initialRevision, message: null, path: null, savedAt: null, conflict: null });
  const revision = useRef(initialRevision);
  const latest = useRef<{ doc: unknown; json: string }>({ doc: initialDoc, json: JSON.stringify(initialDoc) });
  const confirmedJson = useRef(latest.current.json);
  const theirs = useRef<{ revision: number; doc: GuidelineDoc } | null>(null);
  const inFlight = useRef(false);
  const again = useRef(false);
  const inConflict = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  const patch = useCallback((next: Partial<SaveState>) => setState((s) => ({ ...s, ...next })), []);

  // Read once, before the editor mounts: a draft left by a reload or a lost connection.
  const decision = useMemo(() => decideRestore(readDraft(storage(), brandId), { revision: initialRevision, doc: initialDoc }), [brandId, initialRevision, initialDoc]);

  const keepDraft = useCallback(() => {
    writeDraft(storage(), brandId, { baseRevision: revision.current, doc: latest.current.doc as GuidelineDoc, savedAt: Date.now() });
  }, [brandId]);

  const enterConflict = useCallback(
    async (serverRevision: number) => {
      inConflict.current = true;
      let summary: DocSummary | null = null;
      try {
        const current = await api<{ revision: number; doc: GuidelineDoc }>(guidelinePath(brandId));
        theirs.current = current;
        summary = summarize(current.doc);
        serverRevision = current.revision;
      } catch {
        theirs.current = null;
      }
      patch({ status: 'conflict', message: 'Someone saved a newer version while you were editing.', path: null, conflict: { mine: summarize(latest.current.doc as GuidelineDoc), theirs: { revision: serverRevision, summary } } });
    },
    [brandId, patch],
  );

  const flush = useCallback(async () => {
    clearTimeout(timer.current);
    if (inConflict.current) return;
    if (inFlight.current) {
      again.current = true;
      return;
    }
    const { doc, json } = latest.current;
    if (json === confirmedJson.current) {
      clearDraft(storage(), brandId);
      patch({ status: 'saved', message: null, path: null });
      return;
    }
    const checked = validateGuideline(doc);
    if (!checked.ok) {
      patch({ status: 'error', message: `This version cannot be saved yet: ${checked.error.message}`, path: checked.error.path });
      return;
    }
    inFlight.current = true;
    patch({ status: 'saving', message: null, path: null });
    try {
      const res = await api<{ revision: number }>(guidelinePath(brandId), { method: 'PUT', body: { baseRevision: revision.current, doc: checked.doc } });
      revision.current = res.revision;
      confirmedJson.current = json;
      if (latest.current.json === json) clearDraft(storage(), brandId);
      else keepDraft();
      patch({ status: latest.current.json === json ? 'saved' : 'pending', revision: res.revision, savedAt: Date.now(), message: null, path: null });
      if (latest.current.json !== json) again.current = true;
    } catch (error) {
      const e = error instanceof ApiClientError ? error : new ApiClientError(0, 'offline', String(error));
      if (e.status === 0) {
        patch({ status: 'offline', message: 'You are offline. Your changes are kept in this browser and will be saved when the connection returns.' });
        timer.current = setTimeout(() => void flush(), RETRY_MS);
      } else if (e.status === 409) {
        const current = (e.body as { current?: { revision?: number } } | undefined)?.current?.revision;
        await enterConflict(typeof current === 'number' ? current : revision.current + 1);
      } else if (e.status === 400) {
        const path = (e.details as { path?: string } | undefined)?.path ?? null;
        patch({ status: 'error', message: `The server refused this version: ${e.message}`, path });
      } else if (e.status === 403 || e.status === 401) {
        patch({ status: 'error', message: 'You can read these guidelines but not change them; ask an owner for the editor role.' });
      } else {
        patch({ status: 'error', message: `Saving failed (${e.message}). Plumbline will try again shortly.` });
        timer.current = setTimeout(() => void flush(), RETRY_MS);
      }
    } finally {
      inFlight.current = false;
      if (again.current) {
        again.current = false;
        timer.current = setTimeout(() => void flush(), delayMs);
      }
    }
  }, [brandId, delayMs, enterConflict, keepDraft, patch]);

  /** Call with the editor's JSON after every change. */
  const change = useCallback(
    (doc: unknown) => {
      const json = JSON.stringify(doc);
      if (json === latest.current.json) return;
      latest.current = { doc, json };
      keepDraft();
      if (inConflict.current) return;
      patch({ status: 'pending', message: null });
      clearTimeout(timer.current);
      timer.current = setTimeout(() => void flush(), delayMs);
    },
    [delayMs, flush, keepDraft, patch],
  );

  /** The editor's own normalisation of the loaded doc (ids, a trailing paragraph) is not a change worth a save. */
  const adopt = useCallback(
    (doc: unknown) => {
      if (decision.kind !== 'none') return;
      const json = JSON.stringify(doc);
      latest.current = { doc, json };
      confirmedJson.current = json;
      clearTimeout(timer.current);
      patch({ status: 'saved', message: null });
    },
    [decision, patch],
  );

  /** Keep this browser's version: save it on top of the server's newer revision. */
  const keepMine = useCallback(() => {
    if (!state.conflict) return;
    revision.current = state.conflict.theirs.revision;
    inConflict.current = false;
    confirmedJson.current = '';
    patch({ conflict: null, status: 'pending', message: null });
    void flush();
  }, [flush, patch, state.conflict]);

  /** Take the server's version: the caller loads the returned doc into the editor. */
  const takeTheirs = useCallback(async (): Promise<GuidelineDoc | null> => {
    try {
      const current = theirs.current ?? (await api<{ revision: number; doc: GuidelineDoc }>(guidelinePath(brandId)));
      revision.current = current.revision;
      const json = JSON.stringify(current.doc);
      latest.current = { doc: current.doc, json };
      confirmedJson.current = json;
      theirs.current = null;
      inConflict.current = false;
      clearDraft(storage(), brandId);
      patch({ conflict: null, status: 'saved', revision: current.revision, message: null, path: null, savedAt: Date.now() });
      return current.doc;
    } catch (error) {
      patch({ message: `The server’s version could not be loaded: ${(error as Error).message}` });
      return null;
    }
  }, [brandId, patch]);

  // A restored draft is saved at once; a draft made on an older revision opens the conflict choice.
  useEffect(() => {
    if (decision.kind === 'none') return;
    latest.current = { doc: decision.draft.doc, json: JSON.stringify(decision.draft.doc) };
    if (decision.kind === 'restore') {
      patch({ status: 'pending', message: 'Restored changes this browser had not saved yet.' });
      timer.current = setTimeout(() => void flush(), delayMs);
    } else {
      theirs.current = { revision: initialRevision, doc: initialDoc as GuidelineDoc };
      inConflict.current = true;
      patch({
        status: 'conflict',
        message: 'This browser kept changes made on an older version, and the guidelines have been saved since.',
        conflict: { mine: summarize(decision.draft.doc), theirs: { revision: initialRevision, summary: summarize(initialDoc as GuidelineDoc) } },
      });
    }
    // Runs once per loaded document (decision is memoised on it).
  }, [decision]);

  useEffect(() => {
    const online = () => void flush();
    const leave = (e: BeforeUnloadEvent) => {
      if (latest.current.json !== confirmedJson.current) e.preventDefault();
    };
    window.addEventListener('online', online);
    window.addEventListener('beforeunload', leave);
    return () => {
      window.removeEventListener('online', online);
      window.removeEventListener('beforeunload', leave);
      clearTimeout(timer.current);
    };
  }, [flush]);

  return { state, restored: decision.kind === 'none' ? null : decision.draft.doc, change, adopt, saveNow: flush, keepMine, takeTheirs };
}

/** Words for the status line. */
export function statusText(state: SaveState): string {
  switch (state.status) {
    case 'saved':
      return state.savedAt ? `All changes saved at ${formatTime(state.savedAt)}` : 'All changes saved';
    case 'pending':
      return state.message ?? 'Unsaved changes…';
    case 'saving':
      return 'Saving…';
    case 'offline':
    case 'conflict':
    case 'error':
      return state.message ?? 'Not saved';
  }
}
