import { useId, useState } from 'react';
import { Link } from 'react-router-dom';
import { CauseChip } from '../../../components/ui/CauseChip';
import { dateTime, durationSince } from '../../../lib/time-ago';
import type { QueueEntry } from '../api/get-review-queue';
import { CaseHistory } from './CaseHistory';
import { ChecklistView } from './ChecklistView';
import { PredictedVsObserved } from './PredictedVsObserved';
import { ReviewActions } from './ReviewActions';

function Causes({ entry }: { entry: QueueEntry }) {
  const c = entry.case;
  const [top, second] = c.diagnosis?.hypotheses ?? [];
  // with too little recorded the engine ranks every cause alike; naming its "first" would mislead
  const undecided = !top || top.likelihood <= 0 || (second !== undefined && top.likelihood - second.likelihood < 1e-6);
  const engineCause = undecided ? null : top.cause;
  return (
    <div className="flex flex-wrap items-center gap-2">
      <CauseChip prefix="Stated" cause={c.statedCause} tone={c.statedCause && !c.disagreesWithEngine && engineCause ? 'agree' : 'plain'} />
      {c.statedCause === 'other' && c.statedCauseOther && <span className="text-xs">({c.statedCauseOther})</span>}
      {engineCause ? (
        <CauseChip prefix="Engine" cause={engineCause} tone={c.disagreesWithEngine ? 'caution' : 'agree'} />
      ) : (
        <span className="rounded-md border border-dashed border-rule px-2 py-0.5 text-xs text-muted">Engine: no clear cause from the recorded setup</span>
      )}
      {c.disagreesWithEngine && engineCause && (
        <span className="rounded-md bg-caution px-2 py-0.5 text-xs font-semibold text-sheet">Stated cause disagrees with the engine</span>
      )}
    </div>
  );
}

/** One case waiting for review: what it claims, what the system checked, and the decisions. */
export function QueueEntryCard({ entry, now, onDone }: { entry: QueueEntry; now: Date; onDone: (message: string) => void }) {
  const c = entry.case;
  const titleId = useId();
  const [historyOpen, setHistoryOpen] = useState(false);
  const attention = entry.checklist.filter((i) => i.state === 'attention').length;
  return (
    <article aria-labelledby={titleId} data-case-id={c.id} className="rounded-lg border border-rule bg-sheet p-4 shadow-[0_1px_0_var(--ft-rule)] sm:p-5">
      <header className="flex flex-col gap-2">
        <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
          <h2 id={titleId} className="min-w-0 text-lg break-words">
            <Link to={`/cases/${c.id}`} className="underline-offset-2 hover:underline">
              {c.title}
            </Link>
          </h2>
          <span className="font-mono text-sm text-muted">#{c.id}</span>
        </div>
        <p className="text-sm text-muted">
          by <span className="font-semibold text-ink">{c.authorName}</span>
          {entry.ownCase && ' (you)'} · waiting{' '}
          <time dateTime={entry.waitingSince} title={dateTime(entry.waitingSince)} className="font-semibold text-ink">
            {durationSince(entry.waitingSince, now)}
          </time>
          {' · '}
          <span className={attention ? 'font-semibold text-caution' : 'text-agree'}>
            {attention ? `${attention} of ${entry.checklist.length} checks need attention` : 'all checks pass'}
          </span>
        </p>
        <p className="break-words">{c.summary}</p>
        <Causes entry={entry} />
        {c.tags.length > 0 && (
          <ul className="flex flex-wrap gap-1.5" aria-label="Tags">
            {c.tags.map((t) => (
              <li key={t} className="rounded-full border border-rule px-2 py-0.5 font-mono text-xs text-muted">
                {t}
              </li>
            ))}
          </ul>
        )}
      </header>

      <div className="mt-4 grid gap-5 border-t border-rule pt-4 lg:grid-cols-[3fr_2fr]">
        <section aria-label={`Checklist for #${c.id}`}>
          <h3 className="mb-2 font-sans text-xs font-semibold tracking-wide text-muted uppercase">Checklist</h3>
          <ChecklistView items={entry.checklist} />
        </section>
        <section aria-label={`Predicted against observed for #${c.id}`} className="min-w-0">
          <h3 className="mb-2 font-sans text-xs font-semibold tracking-wide text-muted uppercase">Predicted against observed</h3>
          <PredictedVsObserved c={c} />
          {c.reviewNote && (
            <div className="mt-4 rounded-md border-l-4 border-caution bg-caution-soft px-3 py-2 text-sm">
              <p className="font-semibold">Earlier note to the author</p>
              <p className="whitespace-pre-line">{c.reviewNote}</p>
            </div>
          )}
        </section>
      </div>

      <details className="mt-4 border-t border-rule pt-3" onToggle={(e) => setHistoryOpen(e.currentTarget.open)}>
        <summary className="cursor-pointer text-sm font-semibold">History</summary>
        <div className="mt-2">
          <CaseHistory caseId={c.id} enabled={historyOpen} />
        </div>
      </details>

      <div className="mt-4 border-t border-rule pt-4">
        <ReviewActions entry={entry} onDone={onDone} />
      </div>
    </article>
  );
}
