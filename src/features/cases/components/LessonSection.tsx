import { Controller } from 'react-hook-form';
import { ChipsInput } from '../../../components/ui/ChipsInput';
import { TextField } from '../../../components/ui/Field';
import { TextAreaField } from '../../../components/ui/TextAreaField';
import { tagSchema } from '../../../../shared/schemas/case';
import type { CaseFormApi } from '../form/case-form-schema';
import { FormSection } from './FormSection';

const acceptTag = (text: string) => {
  const r = tagSchema.safeParse(text.replace(/\s+/g, '-'));
  return r.success ? { ok: true as const, value: r.data } : { ok: false as const, message: r.error.issues[0].message };
};

export function LessonSection({ form }: { form: CaseFormApi }) {
  const { errors } = form.formState;
  return (
    <FormSection id="lesson" title="Lesson" lead="The one thing the next engineer should check first.">
      <TextField
        label="Lesson in one line"
        placeholder="e.g. check the channel's probe setting matches the probe's switch"
        maxLength={200}
        {...form.register('lessonSummary')}
        error={errors.lessonSummary?.message}
      />
      <TextAreaField label="Lesson detail" rows={3} {...form.register('lessonDetail')} error={errors.lessonDetail?.message} />
      <Controller
        control={form.control}
        name="tags"
        render={({ field, fieldState }) => (
          <ChipsInput
            label="Tags"
            value={field.value}
            onChange={field.onChange}
            accept={acceptTag}
            max={12}
            placeholder="e.g. 10x-at-1x, gate-drive"
            hint="Enter, comma or space adds a tag. The engine adds its own cause tags when it saves."
            error={fieldState.error?.message ?? (Array.isArray(errors.tags) ? errors.tags.find(Boolean)?.message : undefined)}
          />
        )}
      />
    </FormSection>
  );
}
