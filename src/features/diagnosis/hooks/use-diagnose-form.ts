import { useCallback, useDeferredValue, useMemo, useState } from 'react';
import { diagnose } from '../../../../shared/diagnosis/ranker';
import type { DiagnosisInput } from '../../../../shared/schemas/diagnosis';
import { ApiError } from '../../../lib/api-client';
import { useUrlState } from '../../../lib/url-state';
import { useRunDiagnosis } from '../api/run-diagnosis';
import { BLANK_VALUES, DEFAULT_VALUES, FIELDS, type DiagnoseValues, type FieldKey } from '../form/diagnose-fields';
import type { DiagnosePreset } from '../form/presets';
import { queryFromInput, readForm, valuesFromQuery } from '../form/read-form';
import { compareResults } from '../server-agreement';

const inputKey = (input: DiagnosisInput | undefined) => JSON.stringify(input ?? null);

export const fieldId = (key: FieldKey) => `diagnose-${key.replace('.', '-')}`;

/**
 * The Diagnose screen's state: what was typed, what it reads as, the browser's instant
 * diagnosis, and the server's run of the same input when "Diagnose" is pressed.
 */
export function useDiagnoseForm() {
  const { params: searchParams, write } = useUrlState([]);
  // the whole query is the form, so a write replaces it (and the entry: a fill is a correction, not a new place)
  const setQuery = (query: URLSearchParams) => write(Object.fromEntries(query), { fresh: true, replace: true });
  const [initial] = useState(() => valuesFromQuery(searchParams));
  const [values, setValues] = useState<DiagnoseValues>(initial.values);
  const [touched, setTouched] = useState<ReadonlySet<FieldKey>>(() => new Set(initial.touched));
  const [showAllErrors, setShowAllErrors] = useState(initial.touched.length > 0);
  const server = useRunDiagnosis();

  const reading = useMemo(() => readForm(values), [values]);
  // Typing stays smooth; the engine catches up a frame later.
  const deferred = useDeferredValue(reading);
  const local = useMemo(() => diagnose(deferred.input), [deferred]);

  const serverCurrent = server.variables !== undefined && inputKey(server.variables) === inputKey(reading.input);
  const serverIssues =
    serverCurrent && server.error instanceof ApiError ? Object.fromEntries(server.error.issues.map((i) => [i.path, i.message])) : {};
  const errors: Partial<Record<FieldKey, string>> = {};
  for (const f of FIELDS) {
    const message = reading.errors[f.key] ?? serverIssues[f.key];
    if (message && (showAllErrors || touched.has(f.key) || serverIssues[f.key])) errors[f.key] = message;
  }
  const agreement =
    serverCurrent && server.data && inputKey(deferred.input) === inputKey(reading.input) ? compareResults(local, server.data) : undefined;

  const setField = useCallback((key: FieldKey, text: string) => setValues((v) => ({ ...v, [key]: text })), []);
  const touch = useCallback((key: FieldKey) => setTouched((t) => (t.has(key) ? t : new Set(t).add(key))), []);

  const fill = (next: DiagnoseValues, query: URLSearchParams) => {
    setValues(next);
    setTouched(new Set());
    setShowAllErrors(false);
    server.reset();
    setQuery(query);
  };
  const applyPreset = (preset: DiagnosePreset) => fill({ ...BLANK_VALUES, ...preset.values }, new URLSearchParams({ preset: preset.id }));
  const clear = () => fill(DEFAULT_VALUES, new URLSearchParams());

  /** Runs the server's engine on the form; refuses (and shows every message) while a field cannot be read. */
  const submit = (): FieldKey | undefined => {
    const firstError = FIELDS.find((f) => reading.errors[f.key])?.key;
    if (firstError) {
      setShowAllErrors(true);
      return firstError;
    }
    server.mutate(reading.input);
    setQuery(queryFromInput(reading.input));
    return undefined;
  };

  return {
    values,
    errors,
    unreadable: Object.keys(reading.errors) as FieldKey[],
    input: deferred.input,
    local,
    server: {
      pending: server.isPending,
      current: serverCurrent,
      error: serverCurrent && server.error ? server.error : null,
      result: serverCurrent ? server.data : undefined,
      agreement,
    },
    setField,
    touch,
    applyPreset,
    clear,
    submit,
  };
}

export type DiagnoseFormState = ReturnType<typeof useDiagnoseForm>;
