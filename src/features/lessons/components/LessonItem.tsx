import { Link } from 'react-router-dom';
import { Markdown } from '../../../components/ui/Markdown';
import { dateOnly } from '../../../lib/time-ago';
import type { Lesson } from '../../../../shared/schemas/lessons';
import { PinButton } from './PinButton';

export function LessonItem({ lesson, canPin, onError }: { lesson: Lesson; canPin: boolean; onError: (message: string) => void }) {
  return (
    <li className="flex flex-col gap-1 py-4 first:pt-0 last:pb-0" data-case-id={lesson.caseId}>
      <div className="flex flex-wrap items-start justify-between gap-x-4 gap-y-2">
        <p className="min-w-0 flex-1 font-serif font-bold break-words">{lesson.lessonSummary}</p>
        <div className="flex items-center gap-2">
          {lesson.pinned && (
            <span className="rounded-full border border-agree bg-agree-soft px-2 py-0.5 text-xs font-semibold text-agree">on the bench checklist</span>
          )}
          {canPin && <PinButton lesson={lesson} onError={onError} />}
        </div>
      </div>
      {lesson.lessonDetail && <Markdown className="text-sm" references={lesson.references}>
          {lesson.lessonDetail}
        </Markdown>}
      <p className="text-xs text-muted">
        From{' '}
        <Link to={`/cases/${lesson.caseId}`} className="text-ink underline underline-offset-2">
          <span className="font-mono">#{lesson.caseId}</span> {lesson.title}
        </Link>
        {lesson.verifiedAt && <> · verified {dateOnly(lesson.verifiedAt)}</>}
      </p>
    </li>
  );
}
