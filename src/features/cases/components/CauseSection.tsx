import { SelectField, TextField } from '../../../components/ui/Field';
import { TextAreaField } from '../../../components/ui/TextAreaField';
import { CAUSE_LABELS, CAUSES } from '../../../../shared/schemas/diagnosis';
import type { CaseFormApi } from '../form/case-form-schema';
import { FormSection } from './FormSection';

const causeOptions = [{ value: '', label: 'Not decided yet' }, ...CAUSES.map((c) => ({ value: c, label: CAUSE_LABELS[c] })), { value: 'other', label: 'Other…' }];

export function CauseSection({ form }: { form: CaseFormApi }) {
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
    </FormSection>
  );
}
