import { useId, useState } from 'react';
import { useController } from 'react-hook-form';
import { Markdown } from '../../../components/ui/Markdown';
import { useDraftReferences } from '../api/draft-references';
import type { CaseFormApi } from '../form/case-form-schema';

/** The narrative: markdown source beside its live preview; on a phone, one or the other. */
export function MarkdownEditor({ form }: { form: CaseFormApi }) {
  const id = useId();
  const { field, fieldState } = useController({ control: form.control, name: 'narrative' });
  const [view, setView] = useState<'write' | 'preview'>('write');
  const references = useDraftReferences(field.value);
  const tab = (v: typeof view, label: string) => (
    <button
      type="button"
      aria-pressed={view === v}
      onClick={() => setView(v)}
      className={`rounded-md px-3 py-1 text-sm font-semibold ${view === v ? 'bg-ink text-paper' : 'border border-rule'}`}
    >
      {label}
    </button>
  );
  return (
    <div className="flex flex-col gap-1">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <label htmlFor={id} className="text-sm font-semibold">
          Narrative
        </label>
        <div className="flex gap-1 md:hidden" role="group" aria-label="Narrative view">
          {tab('write', 'Write')}
          {tab('preview', 'Preview')}
        </div>
      </div>
      <p id={`${id}-hint`} className="text-xs text-muted">
        What you were measuring, what you saw, how you found the real cause. Markdown: **bold**, lists, `code`, tables; HTML is not rendered.
      </p>
      <div className="grid gap-3 md:grid-cols-2">
        <textarea
          id={id}
          {...field}
          rows={14}
          aria-describedby={`${id}-hint`}
          aria-invalid={fieldState.error ? true : undefined}
          className={`${view === 'write' ? 'block' : 'hidden'} min-h-64 w-full rounded-md border border-rule bg-sheet px-3 py-2 font-mono text-sm focus:border-ink focus:outline-none md:block`}
        />
        <div
          aria-label="Narrative preview"
          role="region"
          className={`${view === 'preview' ? 'block' : 'hidden'} min-h-64 overflow-auto rounded-md border border-dashed border-rule bg-paper/60 px-4 py-2 text-sm md:block`}
        >
          {field.value ? <Markdown references={references}>{field.value}</Markdown> : <p className="py-2 text-muted">The preview appears here as you write.</p>}
        </div>
      </div>
      {fieldState.error && <p className="text-xs font-semibold text-caution">{fieldState.error.message}</p>}
    </div>
  );
}
