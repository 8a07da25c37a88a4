import { TextField } from '../../../components/ui/Field';
import type { CaseFormApi } from '../form/case-form-schema';
import { FormSection } from './FormSection';
import { MarkdownEditor } from './MarkdownEditor';

export function WhatHappenedSection({ form }: { form: CaseFormApi }) {
  const { errors } = form.formState;
  return (
    <FormSection id="what-happened" title="What happened">
      <TextField
        label="Title"
        placeholder="e.g. 3.3 V rail read as 0.33 V on the bring-up board"
        error={errors.title?.message}
        maxLength={160}
        {...form.register('title')}
      />
      <TextField
        label="Symptom in one line"
        placeholder="e.g. amplitude a tenth of what the regulator puts out"
        hint="What the trace did, as you would say it at the bench."
        error={errors.summary?.message}
        maxLength={280}
        {...form.register('summary')}
      />
      <MarkdownEditor form={form} />
    </FormSection>
  );
}
