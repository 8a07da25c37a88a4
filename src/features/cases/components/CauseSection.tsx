import { SelectField, TextField } from '../../../components/ui/Field';
import { TextAreaField } from '../../../components/ui/TextAreaField';
import { CAUSE_LABELS, CAUSES } from '../../../../shared/schemas/diagnosis';
import type { CaseFormApi } from '../form/case-form-schema';
import { FormSection } from './FormSection';

const causeOptions = [{ value: '', label: 'Not decided yet' }, ...CAUSES.map((c) => ({ value: c, label: CAUSE_LABELS[c] })), { value: 'other', label: 'Other…' }];

/** The stated cause, the fix, and the safety note that the review asks for whenever the engine raises a risk. */
export function CauseSection({ form, safetyNeeded = false }: { form: CaseFormApi; safetyNeeded?: boolean }) {
  const cause = form.watch('statedCause');
  const { errors } = form.formState;
  return (
    <FormSection id="cause" title="Root cause and fix" lead="What it really was. The engine's view is in the diagnosis panel; say so if you disagree.">
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Stated cause" options={causeOptions} {...form.register('statedCause')} error={errors.statedCause?.message} />
        {cause === 'other' && (
          <TextField label="Other cause" placeholder="e.g. scope input damaged" {...form.register('statedCauseOther')} error={errors.statedCauseOther?.message} />
        )}
      </div>
      <TextAreaField label="Fix" rows={3} placeholder="e.g. set the channel to 10x; re-measured 3.30 V" {...form.register('fix')} error={errors.fix?.message} />
      <div className={safetyNeeded ? 'rounded-md border-l-4 border-hazard pl-3' : ''}>
        <TextAreaField
          label="Safety note"
          rows={2}
          placeholder="e.g. differential probe rated 1000 V CAT II; scope left earthed; mains side probed with the supply isolated"
          hint={
            safetyNeeded
              ? 'Needed for review: the engine raises a risk for this setup. Say how the circuit was probed safely.'
              : 'How the circuit was probed safely. The review asks for it whenever the engine raises a risk.'
          }
          {...form.register('safetyNote')}
          error={errors.safetyNote?.message}
        />
      </div>
    </FormSection>
  );
}
