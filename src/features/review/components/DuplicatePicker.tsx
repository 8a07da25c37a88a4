import { useId, useState } from 'react';
import { CASE_STATUS_LABELS, type CaseStatus } from '../../../../shared/schemas/case';
import { ApiError } from '../../../lib/api-client';
import { useCaseById, useFindCases } from '../api/find-cases';

interface Candidate {
  id: number;
  title: string;
  status: CaseStatus;
}

export interface DuplicatePickerProps {
  /** The case being marked; it cannot be its own original. */
  caseId: number;
  value: number | undefined;
  onChange: (id: number | undefined) => void;
  error?: string;
}

/** Picks the original a case duplicates: type its number, or words from its title and choose. */
export function DuplicatePicker({ caseId, value, onChange, error }: DuplicatePickerProps) {
  const id = useId();
  const [text, setText] = useState('');
  const asNumber = /^#?\s*\d+$/.test(text.trim()) ? Number(text.trim().replace(/^#\s*/, '')) : null;
  const byId = useCaseById(asNumber);
  const bySearch = useFindCases(asNumber === null ? text.trim() : '');

  let candidates: Candidate[] = [];
  let note = '';
  if (asNumber !== null) {
    if (byId.data) candidates = [byId.data.case];
    else if (byId.error) note = byId.error instanceof ApiError && byId.error.status === 404 ? `There is no case #${asNumber} you can see.` : byId.error.message;
  } else if (bySearch.data && text.trim().length >= 2) {
    candidates = bySearch.data.cases;
    if (candidates.length === 0) note = 'No case matches these words.';
  }
  candidates = candidates.filter((c) => c.id !== caseId);

  return (
    <div className="flex flex-col gap-2">
      <label htmlFor={id} className="text-sm font-semibold">
        Original case
      </label>
      <input
        id={id}
        type="search"
        value={text}
        onChange={(e) => setText(e.target.value)}
        placeholder="Case number (e.g. 12) or words from its title"
        aria-describedby={`${id}-help`}
        aria-invalid={error ? true : undefined}
        className={`w-full rounded-md border bg-sheet px-3 py-2 text-ink placeholder:text-muted/70 focus:border-ink focus:outline-none ${error ? 'border-caution' : 'border-rule'}`}
      />
      <p id={`${id}-help`} className="text-xs text-muted">
        The duplicate is retired and links to the original; its comments stay readable.
      </p>
      {note && <p className="text-sm text-muted">{note}</p>}
      {candidates.length > 0 && (
        <fieldset className="rounded-md border border-rule">
          <legend className="sr-only">Matching cases</legend>
          <ul className="divide-y divide-rule">
            {candidates.map((c) => {
              const retired = c.status === 'retired';
              return (
                <li key={c.id}>
                  <label className={`flex items-baseline gap-2 px-3 py-2 text-sm ${retired ? 'text-muted' : value === c.id ? 'cursor-pointer bg-agree-soft' : 'cursor-pointer hover:bg-paper'}`}>
                    <input type="radio" name={`${id}-pick`} checked={value === c.id} disabled={retired} onChange={() => onChange(c.id)} />
                    <span className="font-mono text-xs">#{c.id}</span>
                    <span className="min-w-0 flex-1 break-words">{c.title}</span>
                    <span className="text-xs text-muted">{retired ? 'retired, cannot be an original' : CASE_STATUS_LABELS[c.status]}</span>
                  </label>
                </li>
              );
            })}
          </ul>
        </fieldset>
      )}
      {error && (
        <p role="alert" className="text-xs font-semibold text-caution">
          {error}
        </p>
      )}
    </div>
  );
}
