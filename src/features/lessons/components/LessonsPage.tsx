import { useEffect, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Alert } from '../../../components/ui/Alert';
import { Loading, PageHeader, Panel } from '../../../components/ui/Panel';
import { useLessons } from '../api/get-lessons';
import { BenchChecklistPanel } from './BenchChecklistPanel';
import { LessonItem } from './LessonItem';

/** Verified lessons grouped by cause, searchable; moderators curate the bench checklist from here. */
export function LessonsPage({ canPin }: { canPin: boolean }) {
  const [params, setParams] = useSearchParams();
  const q = params.get('q') ?? '';
  const [text, setText] = useState(q);
  const [error, setError] = useState('');
  // the address follows the box a moment after typing stops, so each keystroke is not a request
  useEffect(() => {
    const t = setTimeout(() => {
      if (text.trim() === q) return;
      const next = new URLSearchParams(params);
      if (text.trim()) next.set('q', text.trim());
      else next.delete('q');
      setParams(next, { replace: true });
    }, 250);
    return () => clearTimeout(t);
  }, [text, q, params, setParams]);

  const lessons = useLessons(q);
  // the checklist is the whole pinned list, whatever the search
  const all = useLessons('');
  const groups = lessons.data?.groups ?? [];
  const count = groups.reduce((n, g) => n + (g.total ?? g.lessons.length), 0);
  const shownCount = `${count.toLocaleString('en')}${groups.some((g) => g.totalCapped) ? '+' : ''}`;

  return (
    <>
      <PageHeader title="Lessons" lead="What verified cases taught the team, grouped by cause. Read them before you debug the circuit." />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <div className="flex min-w-0 flex-col gap-5">
          <form role="search" onSubmit={(e) => e.preventDefault()} className="flex flex-col gap-1">
            <label htmlFor="lesson-search" className="text-sm font-semibold">
              Search lessons
            </label>
            <input
              id="lesson-search"
              data-kb-search
              type="search"
              value={text}
              onChange={(e) => setText(e.target.value)}
              placeholder="e.g. ground spring, 50 Ω, compensation"
              className="w-full rounded-md border border-rule bg-sheet px-3 py-2 text-ink placeholder:text-muted/70 focus:border-ink focus:outline-none focus:ring-2 focus:ring-agree/60"
            />
            <p className="text-xs text-muted" aria-live="polite">
              {lessons.data && (q ? `${shownCount} lesson${count === 1 ? '' : 's'} match “${q}”.` : `${shownCount} verified lesson${count === 1 ? '' : 's'}.`)}
            </p>
          </form>
          {error && <Alert tone="caution">{error}</Alert>}
          {lessons.isPending && <Loading what="Loading lessons" />}
          {lessons.isError && <Alert tone="caution">{lessons.error.message}</Alert>}
          {lessons.data && groups.length === 0 && (
            <Panel>
              <p className="font-serif text-lg">{q ? 'No lesson matches.' : 'No verified lesson yet.'}</p>
              <p className="mt-1 text-sm text-muted">
                {q ? 'Try fewer or other words.' : 'A case’s lesson appears here once a moderator verifies the case.'}
              </p>
            </Panel>
          )}
          {groups.map((g) => (
            <Panel
              key={g.cause}
              title={
                <>
                  {g.label} <span className="font-mono text-sm font-normal text-muted">({(g.total ?? g.lessons.length).toLocaleString('en')}{g.totalCapped ? '+' : ''})</span>
                </>
              }
            >
              <ul className="divide-y divide-rule">
                {g.lessons.map((l) => (
                  <LessonItem key={l.caseId} lesson={l} canPin={canPin} onError={setError} />
                ))}
              </ul>
              {g.total > g.lessons.length && <p className="mt-2 text-sm text-muted">The latest {g.lessons.length} of {g.total.toLocaleString('en')}{g.totalCapped ? '+' : ''}; search to find the others.</p>}
            </Panel>
          ))}
        </div>
        <aside className="min-w-0">{all.data && <BenchChecklistPanel checklist={all.data.checklist} canPin={canPin} onError={setError} />}</aside>
      </div>
    </>
  );
}
