import { useCallback, useEffect, useRef, useState } from 'react';
import type { WorksheetDraft } from '@biasproof/calc';
import type { Worksheet } from '@biasproof/shared';
import { getWorksheet } from '@/features/worksheets/api/get-worksheet.ts';
import { useUpdateWorksheet } from '@/features/worksheets/api/update-worksheet.ts';
import { draftKey } from '@/features/worksheets/draft/draft-key.ts';
import { ApiError } from '@/lib/api-client.ts';

/** Quiet time after the last edit before the draft is saved. */
export const AUTOSAVE_DEBOUNCE_MS = 800;

/**
 * `saved`: the server holds the draft; `unsaved`: edits wait for the debounce; `saving`: a save
 * is on its way; `conflict`: someone saved since we read (nothing more is sent until the person
 * chooses); `error`: the last save failed (the next edit, or "Try again", sends it again).
 */
export type SaveStatus = 'saved' | 'unsaved' | 'saving' | 'conflict' | 'error';

export interface Autosave {
  status: SaveStatus;
  /** Why the last save failed, for `conflict` and `error`. */
  problem: string | null;
  /** The worksheet as last read or saved, and the draftKey() of the draft it holds. */
  saved: { worksheet: Worksheet; key: string };
  /** Give the hook the editor's newest draft (stable; call on every change). */
  onDraft: (draft: WorksheetDraft) => void;
  /** After a conflict: save the draft over the other person's version. */
  keepMine: () => Promise<void>;
  /** After an error: send the draft again now. */
  retry: () => void;
}

/** The draft a worksheet's current revision holds. */
export function draftOf(worksheet: Worksheet): WorksheetDraft {
  const { circuit, settings } = worksheet.currentRevision;
  return { circuit, settings };
}

/**
 * Saves the author's draft with `PATCH … {version, circuit, settings}` once edits pause. Saves
 * never overlap; edits made during a save are sent by the next one. A 409 `stale-version`
 * stops autosaving until the person resolves the conflict.
 */
export function useAutosave(orgId: string, initial: Worksheet, enabled: boolean): Autosave {
  const { mutateAsync: update } = useUpdateWorksheet(orgId, initial.id);
  const [saved, setSaved] = useState(() => ({
    worksheet: initial,
    key: draftKey(draftOf(initial)),
  }));
  const [status, setStatus] = useState<SaveStatus>('saved');
  const [problem, setProblem] = useState<string | null>(null);

  const draft = useRef<WorksheetDraft | null>(null);
  const version = useRef(initial.version);
  const savedKey = useRef(saved.key);
  const inFlight = useRef(false);
  const inConflict = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  const conflictVersion = useRef<number | null>(null);

  const save = useCallback(
    async (force = false) => {
      clearTimeout(timer.current);
      const sending = draft.current;
      if (!sending || inFlight.current || inConflict.current) return;
      const key = draftKey(sending);
      if (key === savedKey.current && !force) {
        setStatus('saved');
        return;
      }
      inFlight.current = true;
      setStatus('saving');
      try {
        const worksheet = await update({
          version: version.current,
          circuit: sending.circuit,
          settings: sending.settings,
        });
        version.current = worksheet.version;
        savedKey.current = key;
        setSaved({ worksheet, key });
        setProblem(null);
        inFlight.current = false;
        const newest = draft.current;
        if (newest && draftKey(newest) !== key) {
          setStatus('unsaved');
          timer.current = setTimeout(() => void save(), AUTOSAVE_DEBOUNCE_MS);
        } else setStatus('saved');
      } catch (error) {
        inFlight.current = false;
        if (error instanceof ApiError && error.status === 409 && error.code === 'stale-version') {
          inConflict.current = true;
          const current = Number(error.fields?.version);
          conflictVersion.current = Number.isInteger(current) ? current : null;
          setStatus('conflict');
        } else setStatus('error');
        setProblem(error instanceof Error ? error.message : 'The draft could not be saved.');
      }
    },
    [update],
  );

  const onDraft = useCallback(
    (next: WorksheetDraft) => {
      draft.current = next;
      if (!enabled || inConflict.current) return;
      clearTimeout(timer.current);
      if (inFlight.current) return; // the running save looks at the newest draft when it ends
      if (draftKey(next) === savedKey.current) {
        setStatus('saved');
        return;
      }
      setStatus('unsaved');
      timer.current = setTimeout(() => void save(), AUTOSAVE_DEBOUNCE_MS);
    },
    [enabled, save],
  );

  const keepMine = useCallback(async () => {
    version.current = conflictVersion.current ?? (await getWorksheet(orgId, initial.id)).version;
    inConflict.current = false;
    conflictVersion.current = null;
    await save(true);
  }, [save, orgId, initial.id]);

  const retry = useCallback(() => void save(), [save]);

  useEffect(() => () => clearTimeout(timer.current), []);

  return { status, problem, saved, onDraft, keepMine, retry };
}
