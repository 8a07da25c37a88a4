import { useEffect, useState } from 'react';
import { CASE_STATUSES, CASE_STATUS_LABELS } from '../../../../shared/schemas/case';
import { CAUSE_LABELS, CAUSES } from '../../../../shared/schemas/diagnosis';
import { Button } from '../../../components/ui/Button';
import { SelectField, TextField } from '../../../components/ui/Field';
import type { CaseListFilters } from '../api/list-cases';
import { useCaseAuthors } from '../api/list-case-authors';

const causeOptions = [{ value: '', label: 'Any cause' }, ...CAUSES.map((c) => ({ value: c, label: CAUSE_LABELS[c] })), { value: 'other', label: 'Other' }];
const statusOptions = [{ value: '', label: 'Any status' }, ...CASE_STATUSES.map((s) => ({ value: s, label: CASE_STATUS_LABELS[s] }))];

/** A text box that reports what was typed once typing pauses, so each keystroke is not a history entry. */
function useSettled(value: string, onSettle: (v: string) => void, delayMs = 400) {
  const [text, setText] = useState(value);
  useEffect(() => setText(value), [value]);
  useEffect(() => {
    if (text === value) return;
    const t = setTimeout(() => onSettle(text), delayMs);
    return () => clearTimeout(t);
  }, [text, value, onSettle, delayMs]);
  return [text, setText] as const;
}

export function CaseFilters({ filters, onChange, active }: { filters: CaseListFilters; onChange: (c: CaseListFilters) => void; active: boolean }) {
  const authors = useCaseAuthors();
  const [q, setQ] = useSettled(filters.q ?? '', (v) => onChange({ q: v }));
  const [tag, setTag] = useSettled(filters.tag ?? '', (v) => onChange({ tag: v.trim().toLowerCase() }));
  const authorOptions = [{ value: '', label: 'Anyone' }, ...(authors.data?.authors ?? []).map((a) => ({ value: String(a.id), label: a.name }))];
  return (
    <form role="search" aria-label="Filter cases" onSubmit={(e) => e.preventDefault()} className="grid gap-3 sm:grid-cols-2 lg:grid-cols-6">
      <div className="sm:col-span-2">
        <TextField label="Search" type="search" placeholder="title, symptom, narrative" data-kb-search value={q} onChange={(e) => setQ(e.target.value)} />
      </div>
      <SelectField label="Cause" options={causeOptions} value={filters.cause ?? ''} onChange={(e) => onChange({ cause: e.target.value })} />
      <TextField label="Tag" placeholder="e.g. gate-drive" value={tag} onChange={(e) => setTag(e.target.value)} />
      <SelectField label="Status" options={statusOptions} value={filters.status ?? ''} onChange={(e) => onChange({ status: e.target.value })} />
      <SelectField label="Author" options={authorOptions} value={filters.author ?? ''} onChange={(e) => onChange({ author: e.target.value })} />
      <TextField label="Updated from" type="date" value={filters.from ?? ''} onChange={(e) => onChange({ from: e.target.value })} />
      <TextField label="Updated to" type="date" value={filters.to ?? ''} onChange={(e) => onChange({ to: e.target.value })} />
      {active && (
        <div className="flex items-end sm:col-span-2 lg:col-span-4">
          <Button type="button" variant="quiet" className="px-2!" onClick={() => onChange({ q: '', cause: '', tag: '', status: '', author: '', from: '', to: '' })}>
            Clear filters
          </Button>
        </div>
      )}
    </form>
  );
}
