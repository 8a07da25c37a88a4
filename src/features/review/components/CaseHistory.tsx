import { CASE_STATUS_LABELS, type CaseStatus } from '../../../../shared/schemas/case';
import type { AuditEntry } from '../../../../shared/schemas/review';
import { Alert } from '../../../components/ui/Alert';
import { Loading } from '../../../components/ui/Panel';
import { dateTime } from '../../../lib/time-ago';
import { useCaseHistory } from '../api/get-case-history';

const ACTIONS: Record<string, string> = {
  submit: 'Submitted for review',
  send_back: 'Sent back for changes',
  verify: 'Verified',
  retire: 'Retired',
  duplicate: 'Marked as a duplicate',
  moderator_edit: 'Edited by a moderator',
  pin_lesson: 'Lesson pinned to the bench checklist',
  unpin_lesson: 'Lesson taken off the bench checklist',
};

// keys that say nothing to a reader of the history
const HIDDEN_KEYS = new Set(['baseUpdatedAt']);

function show(key: string, value: unknown): string {
  if (value === null || value === undefined || value === '') return '—';
  if (key === 'status' && typeof value === 'string') return CASE_STATUS_LABELS[value as CaseStatus] ?? value;
  if (key === 'duplicateOf') return `#${String(value)}`;
  const text = typeof value === 'string' ? value : JSON.stringify(value);
  return text.length > 120 ? `${text.slice(0, 117)}…` : text;
}

function Changes({ entry }: { entry: AuditEntry }) {
  const keys = [...new Set([...Object.keys(entry.before ?? {}), ...Object.keys(entry.after ?? {})])].filter((k) => !HIDDEN_KEYS.has(k));
  if (keys.length === 0) return null;
  return (
    <ul className="mt-1 text-xs">
      {keys.map((k) => (
        <li key={k} className="break-words">
          <span className="text-muted">{k}: </span>
          <span className="font-mono">{show(k, entry.before?.[k])}</span>
          <span aria-label="became"> → </span>
          <span className="font-mono">{show(k, entry.after?.[k])}</span>
        </li>
      ))}
    </ul>
  );
}

/** Every state change and moderator edit of a case (who, when, what, before and after), newest first. */
export function CaseHistory({ caseId, enabled = true }: { caseId: number; enabled?: boolean }) {
  const history = useCaseHistory(caseId, enabled);
  if (history.isPending) return enabled ? <Loading what="Loading the history" /> : null;
  if (history.isError) return <Alert tone="caution">{history.error.message}</Alert>;
  if (history.data.history.length === 0) return <p className="text-sm text-muted">No state changes yet.</p>;
  return (
    <ol className="flex flex-col gap-2 border-l-2 border-rule pl-4">
      {history.data.history.map((e) => (
        <li key={e.id} className="text-sm">
          <p>
            <span className="font-semibold">{ACTIONS[e.action] ?? e.action.replace(/_/g, ' ')}</span>
            <span className="text-muted">
              {' '}
              by {e.actorName ?? 'the system'} · <time dateTime={e.createdAt}>{dateTime(e.createdAt)}</time>
            </span>
          </p>
          {e.note && <p className="whitespace-pre-line">“{e.note}”</p>}
          <Changes entry={e} />
        </li>
      ))}
    </ol>
  );
}
