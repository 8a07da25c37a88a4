import { Button } from '../../../components/ui/Button';
import { usePinLesson } from '../api/pin-lesson';
import type { Lesson } from '../../../../shared/schemas/lessons';

/** Puts a lesson on the bench checklist or takes it off (moderators). */
export function PinButton({ lesson, onError }: { lesson: Lesson; onError: (message: string) => void }) {
  const pin = usePinLesson();
  return (
    <Button
      variant={lesson.pinned ? 'quiet' : 'secondary'}
      className="px-3 py-1 text-xs"
      busy={pin.isPending}
      aria-pressed={lesson.pinned}
      aria-label={`${lesson.pinned ? 'Unpin from' : 'Pin to'} the bench checklist: ${lesson.lessonSummary}`}
      onClick={() => pin.mutate({ caseId: lesson.caseId, pinned: !lesson.pinned }, { onError: (e) => onError(e.message) })}
    >
      {lesson.pinned ? 'Unpin' : 'Pin to checklist'}
    </Button>
  );
}
