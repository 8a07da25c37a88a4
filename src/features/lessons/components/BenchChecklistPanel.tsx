import { Link } from 'react-router-dom';
import { Panel } from '../../../components/ui/Panel';
import type { Lesson } from '../../../../shared/schemas/lessons';
import { useReorderChecklist } from '../api/reorder-checklist';
import { PinButton } from './PinButton';

const moveButton = 'rounded border border-rule px-1.5 text-xs leading-5 hover:border-ink disabled:cursor-not-allowed disabled:opacity-40';

/** The pinned lessons, in order: the short list to go through before trusting a trace. */
export function BenchChecklistPanel({ checklist, canPin, onError }: { checklist: Lesson[]; canPin: boolean; onError: (message: string) => void }) {
  const reorder = useReorderChecklist();
  const move = (from: number, to: number) => {
    const ids = checklist.map((l) => l.caseId);
    const [id] = ids.splice(from, 1);
    ids.splice(to, 0, id);
    reorder.mutate({ caseIds: ids }, { onError: (e) => onError(e.message) });
  };
  return (
    <Panel title="Bench checklist" className="lg:sticky lg:top-4 lg:max-h-[calc(100vh-2rem)] lg:overflow-y-auto">
      {checklist.length === 0 ? (
        <p className="text-sm text-muted">
          {canPin ? 'Nothing pinned yet. Pin the lessons every engineer should check at the bench.' : 'Moderators have not pinned any lesson yet.'}
        </p>
      ) : (
        <ol className="flex flex-col gap-2 text-sm" aria-label="Pinned lessons">
          {checklist.map((l, i) => (
            <li key={l.caseId} data-pinned-case-id={l.caseId} className="flex items-start gap-2">
              <span className="w-5 shrink-0 pt-0.5 text-right font-mono text-xs text-muted">{i + 1}.</span>
              <span className="min-w-0 flex-1 break-words">{l.lessonSummary}</span>
              {canPin && (
                <span className="flex shrink-0 items-center gap-1">
                  <button
                    type="button"
                    className={moveButton}
                    disabled={i === 0 || reorder.isPending}
                    aria-label={`Move up: ${l.lessonSummary}`}
                    title="Move up"
                    onClick={() => move(i, i - 1)}
                  >
                    ↑
                  </button>
                  <button
                    type="button"
                    className={moveButton}
                    disabled={i === checklist.length - 1 || reorder.isPending}
                    aria-label={`Move down: ${l.lessonSummary}`}
                    title="Move down"
                    onClick={() => move(i, i + 1)}
                  >
                    ↓
                  </button>
                  <PinButton lesson={l} onError={onError} />
                </span>
              )}
            </li>
          ))}
        </ol>
      )}
      <Link
        to="/lessons/checklist"
        className="mt-4 inline-flex items-center justify-center rounded-md border border-ink bg-ink px-4 py-2 text-sm font-semibold text-paper hover:opacity-90"
      >
        Print checklist
      </Link>
    </Panel>
  );
}
