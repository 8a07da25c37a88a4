import { useMemo, useState } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { useKeyboardList } from '../../../components/keyboard/use-keyboard-list';
import { CAUSE_LABELS, CAUSES } from '../../../../shared/schemas/diagnosis';
import { Alert } from '../../../components/ui/Alert';
import { Loading, PageHeader, Panel } from '../../../components/ui/Panel';
import { useReviewQueue } from '../api/get-review-queue';
import { QueueEntryCard } from './QueueEntryCard';
import { ReviewNav } from './ReviewNav';

const CAUSE_OPTIONS = [{ value: '', label: 'Any cause' }, ...CAUSES.map((c) => ({ value: c, label: CAUSE_LABELS[c] })), { value: 'other', label: 'Other cause' }];

const NO_ENTRIES: never[] = [];

/** The review desk: cases waiting for a moderator, oldest first, filters in the address. */
export function ReviewDeskPage() {
  const [params, setParams] = useSearchParams();
  // the controls answer at once; the address follows, so a filtered desk can be linked and reloaded
  const [cause, setCause] = useState(params.get('cause') ?? '');
  const [attention, setAttention] = useState(params.get('attention') === '1');
  const filters = useMemo(() => ({ ...(cause && { cause }), ...(attention && { attention }) }), [cause, attention]);
  const queue = useReviewQueue(filters);
  const [done, setDone] = useState('');
  // one clock per render of the list, so waiting times agree with each other
  const now = useMemo(() => new Date(), [queue.dataUpdatedAt]);

  const setFilter = (key: 'cause' | 'attention', value: string) => {
    if (key === 'cause') setCause(value);
    else setAttention(value === '1');
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };

  const entries = queue.data?.queue ?? NO_ENTRIES;
  const navigate = useNavigate();
  const keyboard = useKeyboardList(entries, (entry) => navigate(`/cases/${entry.case.id}`));
  const filtered = Boolean(cause || attention);
  return (
    <>
      <PageHeader
        title="Review desk"
        lead="Cases waiting for a moderator's verification, oldest first. The checklist is filled in from the case itself; you decide."
      />
      <ReviewNav />
      <div className="flex flex-col gap-5">
        <form role="search" aria-label="Filter the queue" onSubmit={(e) => e.preventDefault()} className="flex flex-wrap items-end gap-x-6 gap-y-3 rounded-lg border border-rule bg-sheet px-4 py-3">
          <div className="flex flex-col gap-1">
            <label htmlFor="queue-cause" className="text-sm font-semibold">
              Cause
            </label>
            <select id="queue-cause" value={cause} onChange={(e) => setFilter('cause', e.target.value)} className="rounded-md border border-rule bg-sheet px-3 py-2">
              {CAUSE_OPTIONS.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </select>
          </div>
          <label className="flex items-center gap-2 py-2 text-sm font-semibold">
            <input type="checkbox" checked={attention} onChange={(e) => setFilter('attention', e.target.checked ? '1' : '')} className="h-4 w-4 accent-[var(--ft-caution)]" />
            Only cases that need attention
          </label>
          <p className="ml-auto py-2 text-sm text-muted" aria-live="polite">
            {queue.data && (
              <>
                <span className="font-mono text-ink">{entries.length}</span> {entries.length === 1 ? 'case' : 'cases'} {filtered ? 'match' : 'waiting'}
                {queue.data.waiting > entries.length && !attention && <> (the oldest of <span className="font-mono text-ink">{queue.data.waiting}</span>)</>}
              </>
            )}
          </p>
        </form>

        {done && (
          <Alert tone="agree">
            <span className="flex flex-wrap items-baseline justify-between gap-2">
              {done}
              <button type="button" className="text-xs underline" onClick={() => setDone('')}>
                Dismiss
              </button>
            </span>
          </Alert>
        )}
        {queue.isPending && <Loading what="Loading the queue" />}
        {queue.isError && <Alert tone="caution">{queue.error.message}</Alert>}
        {queue.data && entries.length === 0 && (
          <Panel>
            <p className="font-serif text-lg">{filtered ? 'No waiting case matches these filters.' : 'Nothing is waiting for review.'}</p>
            <p className="mt-1 text-sm text-muted">
              {filtered ? 'Clear a filter to see the rest of the queue.' : 'Submitted cases appear here, oldest first; moderators get a mail for each one.'}
            </p>
          </Panel>
        )}
        <ol className="flex flex-col gap-5" aria-label="Cases waiting for review" {...keyboard.listProps}>
          {entries.map((entry, i) => (
            <li key={entry.case.id} className="rounded-lg" {...keyboard.rowProps(i)}>
              <QueueEntryCard entry={entry} now={now} onDone={setDone} />
            </li>
          ))}
        </ol>
      </div>
    </>
  );
}
