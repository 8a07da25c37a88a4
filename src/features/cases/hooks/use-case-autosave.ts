import { useCallback, useEffect, useRef, useState } from 'react';
import type { Case } from '../../../../shared/schemas/case';
import { ApiError } from '../../../lib/api-client';
import { useCreateCase } from '../api/create-case';
import { getCase } from '../api/get-case';
import { useUpdateCase } from '../api/update-case';
import { caseFormSchema, type CaseFormApi, type CaseFormValues } from '../form/case-form-schema';
import { caseToFormValues } from '../form/case-form-values';
import { clearLocalDraft, writeLocalDraft } from './local-draft';

export type SaveState =
  | { kind: 'clean' }
  | { kind: 'dirty' }
  | { kind: 'saving' }
  | { kind: 'saved'; at: Date }
  | { kind: 'failed'; reason: string; conflict?: boolean };

export const AUTOSAVE_DELAY_MS = 1500;

const canonical = (values: CaseFormValues) => {
  const parsed = caseFormSchema.safeParse(values);
  return parsed.success ? JSON.stringify(parsed.data) : null;
};

function firstProblem(values: CaseFormValues, isNew: boolean): string {
  const parsed = caseFormSchema.safeParse(values);
  if (parsed.success) return '';
  const issue = parsed.error.issues[0];
  if (isNew && (issue.path[0] === 'title' || issue.path[0] === 'summary')) return 'give the case a title and a one-line summary first';
  return issue.message;
}

export interface AutosaveOptions {
  form: CaseFormApi;
  userId: number;
  initialCase: Case | null;
  /** The first save created the case; this editor goes on saving to it. */
  onCreated: (c: Case) => void;
}

/**
 * Debounced draft autosave: every change is kept in localStorage at once and sent to the server
 * AUTOSAVE_DELAY_MS after typing stops, one request at a time. The first successful save of a
 * new case creates it, and later saves go to that case. A 409 whose server copy matches what this editor last saved (only an
 * attachment changed the version) is retried on the new version; a real conflict stops and says so.
 */
export function useCaseAutosave({ form, userId, initialCase, onCreated }: AutosaveOptions) {
  const { mutateAsync: createCase } = useCreateCase();
  const { mutateAsync: updateCase } = useUpdateCase();
  const caseId = useRef<number | null>(initialCase?.id ?? null);
  const base = useRef<string | null>(initialCase?.updatedAt ?? null);
  const savedJson = useRef(JSON.stringify(form.getValues()));
  const savedCanonical = useRef(canonical(form.getValues()));
  const [state, setState] = useState<SaveState>({ kind: 'clean' });
  const timer = useRef<ReturnType<typeof setTimeout>>(undefined);
  const running = useRef<Promise<boolean> | null>(null);
  const again = useRef(false);
  // after a real conflict, keep edits locally but stop sending them until the editor reloads
  const conflicted = useRef(false);

  const send = useCallback(
    async (values: CaseFormValues, retried = false): Promise<Case> => {
      const input = caseFormSchema.parse(values);
      if (caseId.current === null) return (await createCase(input)).case;
      try {
        // the server refuses a change that does not name the version it edits
        return (await updateCase({ id: caseId.current, ...input, baseUpdatedAt: base.current ?? '' })).case;
      } catch (err) {
        if (retried || !(err instanceof ApiError) || err.status !== 409) throw err;
        const fresh = (await getCase(caseId.current)).case;
        if (canonical(caseToFormValues(fresh)) !== savedCanonical.current) throw err;
        base.current = fresh.updatedAt;
        return send(values, true);
      }
    },
    [createCase, updateCase],
  );

  const saveOnce = useCallback(async (): Promise<boolean> => {
    const values = form.getValues();
    const json = JSON.stringify(values);
    if (json === savedJson.current && caseId.current !== null) return true;
    const problem = firstProblem(values, caseId.current === null);
    if (problem) {
      setState({ kind: 'failed', reason: problem });
      return false;
    }
    setState({ kind: 'saving' });
    try {
      const wasNew = caseId.current === null;
      const saved = await send(values);
      caseId.current = saved.id;
      base.current = saved.updatedAt;
      savedJson.current = json;
      savedCanonical.current = canonical(values);
      const at = new Date();
      const now = form.getValues();
      if (JSON.stringify(now) === json) {
        clearLocalDraft(userId, saved.id);
        setState({ kind: 'saved', at });
      } else {
        again.current = true;
        // typed while the save was on its way: kept under the case's own key until the next save
        writeLocalDraft(userId, saved.id, { values: now, editedAt: new Date().toISOString(), baseUpdatedAt: saved.updatedAt, baseValues: values });
      }
      if (wasNew) {
        clearLocalDraft(userId, null);
        onCreated(saved);
      }
      return true;
    } catch (err) {
      const conflict = err instanceof ApiError && err.status === 409;
      if (conflict) conflicted.current = true;
      if (err instanceof ApiError) {
        for (const issue of err.issues) {
          if (issue.path) form.setError(issue.path as never, { message: issue.message });
        }
      }
      setState({ kind: 'failed', reason: err instanceof Error ? err.message : 'the server did not answer', conflict });
      return false;
    }
  }, [form, onCreated, send, userId]);

  /** Saves now (waiting for a save in flight first); resolves true when the server has every change. */
  const flush = useCallback(async (): Promise<boolean> => {
    clearTimeout(timer.current);
    if (running.current) {
      again.current = true;
      await running.current;
    }
    running.current = saveOnce();
    let ok = await running.current;
    while (ok && again.current) {
      again.current = false;
      running.current = saveOnce();
      ok = await running.current;
    }
    running.current = null;
    return ok;
  }, [saveOnce]);

  const changed = useCallback(() => {
    const values = form.getValues();
    const json = JSON.stringify(values);
    clearTimeout(timer.current);
    if (json === savedJson.current) {
      clearLocalDraft(userId, caseId.current);
      setState((s) => (s.kind === 'dirty' || s.kind === 'failed' ? { kind: 'clean' } : s));
      return;
    }
    writeLocalDraft(userId, caseId.current, { values, editedAt: new Date().toISOString(), baseUpdatedAt: base.current, baseValues: JSON.parse(savedJson.current) as CaseFormValues });
    if (conflicted.current) return;
    setState({ kind: 'dirty' });
    timer.current = setTimeout(() => {
      if (running.current) again.current = true;
      else void flush();
    }, AUTOSAVE_DELAY_MS);
  }, [flush, form, userId]);

  // subscribe once; a re-subscription must not cancel the pending save
  const latestChanged = useRef(changed);
  latestChanged.current = changed;
  useEffect(() => {
    const sub = form.watch(() => latestChanged.current());
    return () => sub.unsubscribe();
  }, [form]);
  useEffect(() => () => clearTimeout(timer.current), []);

  /** The server copy moved on because of this editor's own uploads: adopt its version. */
  const adoptServerCase = useCallback((c: Case) => {
    if (c.id === caseId.current && c.updatedAt !== base.current && canonical(caseToFormValues(c)) === savedCanonical.current) base.current = c.updatedAt;
  }, []);

  return { state, flush, changed, adoptServerCase, caseId: () => caseId.current, savedJson: () => savedJson.current };
}
