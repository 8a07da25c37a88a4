import { useState } from 'react';
import type { ReviewAction } from '../../../../shared/schemas/review';
import { Button } from '../../../components/ui/Button';
import type { QueueEntry } from '../api/get-review-queue';
import { ReviewForm } from './ReviewForm';

const ACTIONS: { action: ReviewAction; label: string }[] = [
  { action: 'verify', label: 'Verify' },
  { action: 'send_back', label: 'Send back' },
  { action: 'duplicate', label: 'Mark duplicate of…' },
  { action: 'retire', label: 'Retire' },
];

/** The four decisions; an author's own case shows them disabled, with the reason. */
export function ReviewActions({ entry, onDone }: { entry: QueueEntry; onDone: (message: string) => void }) {
  const [open, setOpen] = useState<ReviewAction | null>(null);
  const c = entry.case;
  const attention = entry.checklist.filter((i) => i.state === 'attention').map((i) => i.label);
  const formId = `review-form-${c.id}`;
  return (
    <div className="flex flex-col gap-3">
      <div role="group" aria-label={`Decide on #${c.id}`} className="flex flex-wrap gap-2">
        {ACTIONS.map(({ action, label }) => (
          <Button
            key={action}
            type="button"
            variant={open === action ? 'primary' : 'secondary'}
            disabled={entry.ownCase}
            aria-expanded={entry.ownCase ? undefined : open === action}
            aria-controls={open === action ? formId : undefined}
            onClick={() => setOpen(open === action ? null : action)}
          >
            {label}
          </Button>
        ))}
      </div>
      {entry.ownCase && (
        <p className="text-sm font-semibold text-caution">You wrote this case: another moderator must review this.</p>
      )}
      {open && !entry.ownCase && (
        <div id={formId}>
          <ReviewForm key={open} caseId={c.id} title={c.title} action={open} attention={attention} onCancel={() => setOpen(null)} onDone={onDone} />
        </div>
      )}
    </div>
  );
}
