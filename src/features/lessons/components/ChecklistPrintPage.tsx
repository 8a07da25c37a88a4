import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { causeLabel } from '../../../components/ui/CauseChip';
import { Loading } from '../../../components/ui/Panel';
import { dateOnly } from '../../../lib/time-ago';
import { useLessons } from '../api/get-lessons';

// past this many items two columns keep the sheet to one page; past the second, details shrink to a line
const ONE_COLUMN_MAX = 8;
const FULL_DETAIL_MAX = 16;

/**
 * The bench checklist as a sheet of paper: black on white on screen and in print, no app
 * navigation, tick boxes to mark with a pen. Shown outside the app shell.
 */
export function ChecklistPrintPage() {
  const lessons = useLessons('');
  const checklist = lessons.data?.checklist ?? [];
  const twoColumns = checklist.length > ONE_COLUMN_MAX;
  const dense = checklist.length > FULL_DETAIL_MAX;
  return (
    <div className="min-h-screen bg-paper px-4 py-6 print:bg-white print:p-0">
      <style>{'@page { margin: 14mm; }'}</style>
      <div className="mx-auto mb-4 flex max-w-[52rem] flex-wrap items-center justify-between gap-3 print:hidden">
        <Link to="/lessons" className="text-sm font-semibold underline underline-offset-2">
          ← Back to Lessons
        </Link>
        <div className="flex items-center gap-3">
          <p className="text-sm text-muted">Fits one page; print it and keep it at the bench.</p>
          <Button onClick={() => window.print()} disabled={checklist.length === 0}>
            Print
          </Button>
        </div>
      </div>
      {lessons.isPending && <Loading what="Loading the checklist" />}
      {lessons.isError && <Alert tone="caution">{lessons.error.message}</Alert>}
      {lessons.data && (
        <article className="mx-auto max-w-[52rem] bg-white px-6 py-8 text-black shadow-md sm:px-12 sm:py-10 print:max-w-none print:p-0 print:shadow-none">
          <header className="flex flex-wrap items-end justify-between gap-2 border-b-2 border-black pb-2">
            <div>
              <h1 className="font-serif text-2xl font-bold text-black print:text-[20pt]">Bench checklist</h1>
              <p className="text-sm text-neutral-700">Before you trust the trace, check:</p>
            </div>
            <p className="text-right text-xs text-neutral-700">
              Falsetrace casebook
              <br />
              printed {dateOnly(new Date().toISOString())}
            </p>
          </header>
          {checklist.length === 0 ? (
            <p className="mt-6 text-neutral-700">No lesson is pinned yet. Moderators pin lessons to this checklist from the Lessons page.</p>
          ) : (
            <ol className={`mt-3 ${twoColumns ? 'gap-8 sm:columns-2 print:columns-2' : ''}`}>
              {checklist.map((l, i) => (
                <li key={l.caseId} className="flex break-inside-avoid gap-3 border-b border-neutral-300 py-2.5">
                  <span aria-hidden className="mt-1 h-4 w-4 shrink-0 border-2 border-black" />
                  <div className="min-w-0">
                    <p className="font-semibold leading-snug text-black print:text-[11pt]">
                      <span className="mr-1 font-mono text-sm">{i + 1}.</span>
                      {l.lessonSummary}
                    </p>
                    {l.lessonDetail && <p className={`mt-0.5 ${dense ? 'line-clamp-1' : 'line-clamp-3'} text-sm leading-snug text-neutral-800 print:text-[9.5pt]`}>{l.lessonDetail}</p>}
                    <p className="mt-0.5 text-xs text-neutral-600 print:text-[8pt]">
                      {causeLabel(l.cause)} · case <span className="font-mono">#{l.caseId}</span>
                    </p>
                  </div>
                </li>
              ))}
            </ol>
          )}
          <footer className="mt-4 text-xs text-neutral-600 print:text-[8pt]">
            Each line comes from a verified case; look the case up in Falsetrace for the setup and the waveforms.
          </footer>
        </article>
      )}
    </div>
  );
}
