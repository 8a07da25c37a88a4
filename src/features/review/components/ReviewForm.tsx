import { useState } from 'react';
import { reviewInputSchema, type ReviewAction } from '../../../../shared/schemas/review';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { TextAreaField } from '../../../components/ui/TextAreaField';
import { applyServerError, useZodForm } from '../../../lib/forms';
import { useReviewCase } from '../api/review-case';
import { DuplicatePicker } from './DuplicatePicker';

const COPY: Record<ReviewAction, { note: string; hint?: string; submit: string; done: string; tone: 'primary' | 'danger' }> = {
  verify: { note: 'Note for the author (optional)', submit: 'Verify case', done: 'Verified', tone: 'primary' },
  send_back: {
    note: 'What should the author change?',
    hint: 'The author sees this on the case and in the form, and gets it by mail.',
    submit: 'Send back',
    done: 'Sent back',
    tone: 'primary',
  },
  duplicate: { note: 'Note (optional)', submit: 'Mark duplicate', done: 'Marked as a duplicate', tone: 'primary' },
  retire: { note: 'Reason for retiring', hint: 'Shown on the retired case.', submit: 'Retire case', done: 'Retired', tone: 'danger' },
};

export interface ReviewFormProps {
  caseId: number;
  title: string;
  action: ReviewAction;
  /** Checks in attention: verifying over them deserves a second look. */
  attention: string[];
  onCancel: () => void;
  onDone: (message: string) => void;
}

/** One decision on one case, validated by the same schema the server parses. */
export function ReviewForm({ caseId, title, action, attention, onCancel, onDone }: ReviewFormProps) {
  const review = useReviewCase();
  const form = useZodForm(reviewInputSchema, { action, note: '' });
  const [message, setMessage] = useState('');
  const copy = COPY[action];
  const { errors } = form.formState;
  const duplicateOf = form.watch('duplicateOf') as number | undefined;

  const onSubmit = form.handleSubmit(async (values) => {
    setMessage('');
    try {
      await review.mutateAsync({ caseId, action: values.action, note: values.note || undefined, duplicateOf: values.duplicateOf });
      onDone(`${copy.done}: #${caseId} “${title}”${values.duplicateOf ? ` (original #${values.duplicateOf})` : ''}.`);
    } catch (err) {
      setMessage(applyServerError(form, err));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3 rounded-md border border-rule bg-paper p-4" aria-label={`${copy.submit}: ${title}`}>
      {message && <Alert tone="caution">{message}</Alert>}
      {action === 'verify' && attention.length > 0 && (
        <Alert tone="caution" title={`${attention.length} check${attention.length > 1 ? 's need' : ' needs'} attention`}>
          {attention.join('; ')}. Verify only if you have checked {attention.length > 1 ? 'them' : 'it'} yourself.
        </Alert>
      )}
      {action === 'duplicate' && (
        <DuplicatePicker
          caseId={caseId}
          value={duplicateOf}
          onChange={(v) => form.setValue('duplicateOf', v, { shouldValidate: form.formState.isSubmitted })}
          error={errors.duplicateOf?.message}
        />
      )}
      <TextAreaField label={copy.note} hint={copy.hint} rows={action === 'verify' || action === 'duplicate' ? 2 : 4} error={errors.note?.message} {...form.register('note')} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant={copy.tone} busy={review.isPending}>
          {copy.submit}
        </Button>
        <Button type="button" variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
