import { useEffect, useState, type FormEvent } from 'react';
import { CopyLinkButton } from '../../../components/ui/CopyLinkButton';
import type { Assumption } from '../../../../shared/schemas/diagnosis';
import { formatEngineering } from '../../../../shared/units/engineering';
import { Button } from '../../../components/ui/Button';
import { SelectField } from '../../../components/ui/Field';
import { QuantityField } from '../../../components/ui/QuantityField';
import { SECTIONS, type ChoiceFieldDef, type FieldDef, type SectionDef } from '../form/diagnose-fields';
import { assumptionValue } from '../form/labels';
import { PRESETS } from '../form/presets';
import { fieldId, type DiagnoseFormState } from '../hooks/use-diagnose-form';

function choiceOptions(f: ChoiceFieldDef, value: string) {
  if (f.options.some((o) => o.value === value)) return f.options;
  // A link may ask for an input resistance the menu does not list (a 75 Ω input, say).
  const n = Number(value);
  return [...f.options, { value, label: Number.isFinite(n) ? formatEngineering(n, 'Ω') : value }];
}

function Field({ f, form, assumed }: { f: FieldDef; form: DiagnoseFormState; assumed?: Assumption }) {
  const value = form.values[f.key];
  const assumedText = assumed && value === '' ? `Blank: the engine assumes ${assumptionValue(assumed)}.` : undefined;
  const hint = [f.hint, assumedText].filter(Boolean).join(' ') || undefined;
  if (f.kind === 'choice') {
    return (
      <SelectField
        id={fieldId(f.key)}
        label={f.label}
        value={value}
        options={choiceOptions(f, value)}
        hint={hint}
        onChange={(e) => form.setField(f.key, e.target.value)}
      />
    );
  }
  return (
    <QuantityField
      id={fieldId(f.key)}
      name={f.key}
      label={f.label}
      unit={f.unit}
      value={value}
      placeholder={f.placeholder}
      hint={hint}
      error={form.errors[f.key]}
      onChange={(e) => form.setField(f.key, e.target.value)}
      onBlur={() => form.touch(f.key)}
    />
  );
}

function Fields({ section, form, assumed }: { section: SectionDef; form: DiagnoseFormState; assumed: Map<string, Assumption> }) {
  return (
    <div className="mt-1 grid gap-x-4 gap-y-3 sm:grid-cols-2">
      {section.fields.map((f) => (
        <Field key={f.key} f={f} form={form} assumed={assumed.get(f.key)} />
      ))}
    </div>
  );
}

/** A group the common case skips: folded until opened, and open whenever one of its fields holds a value (a preset, a link). */
function FoldedSection({ section, form, assumed }: { section: SectionDef; form: DiagnoseFormState; assumed: Map<string, Assumption> }) {
  const filled = section.fields.some((f) => form.values[f.key] !== '');
  const hasError = section.fields.some((f) => form.errors[f.key]);
  const [open, setOpen] = useState(filled);
  useEffect(() => {
    if (filled || hasError) setOpen(true);
  }, [filled, hasError]);
  return (
    <details open={open} onToggle={(e) => setOpen(e.currentTarget.open)} className="group min-w-0 border-t border-rule pt-3" data-group={section.id}>
      <summary className="flex cursor-pointer list-none items-baseline gap-2">
        <span aria-hidden className="inline-block w-3 font-mono text-xs text-muted transition-transform group-open:rotate-90">
          ▸
        </span>
        <span className="font-serif text-base font-bold">{section.title}</span>
        <span className="min-w-0 truncate text-xs text-muted">{section.collapsible?.lead}</span>
      </summary>
      <div className="mt-2">
        <Fields section={section} form={form} assumed={assumed} />
      </div>
    </details>
  );
}

/** Setup and observation, every number in engineering notation, with example setups that fill it. */
export function DiagnoseForm({ form, assumptions }: { form: DiagnoseFormState; assumptions: Assumption[] }) {
  const assumedByField = new Map(assumptions.map((a) => [a.field, a]));
  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    const firstError = form.submit();
    if (firstError) document.getElementById(fieldId(firstError))?.focus();
  };
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Setup and observation" className="flex flex-col gap-5">
      <div>
        <p id="diagnose-presets" className="text-sm font-semibold">
          Start from an example
        </p>
        <ul aria-labelledby="diagnose-presets" className="mt-2 flex flex-wrap gap-2">
          {PRESETS.map((p) => (
            <li key={p.id}>
              <button
                type="button"
                onClick={() => form.applyPreset(p)}
                className="rounded-full border border-rule bg-paper px-3 py-1 text-sm hover:border-ink"
              >
                {p.label}
              </button>
            </li>
          ))}
        </ul>
      </div>
      {SECTIONS.filter((s) => !s.collapsible).map((section) => (
        <fieldset key={section.id} className="min-w-0 border-t border-rule pt-3">
          <legend className="pr-2 font-serif text-base font-bold">{section.title}</legend>
          <Fields section={section} form={form} assumed={assumedByField} />
        </fieldset>
      ))}
      <div className="flex flex-col gap-3">
        <p className="text-xs text-muted">More of the setup, when you recorded it:</p>
        {SECTIONS.filter((s) => s.collapsible).map((section) => (
          <FoldedSection key={section.id} section={section} form={form} assumed={assumedByField} />
        ))}
      </div>
      <div className="flex flex-wrap items-center gap-3 border-t border-rule pt-4">
        <Button type="submit" busy={form.server.pending}>
          Diagnose
        </Button>
        <Button type="button" variant="secondary" onClick={form.clear}>
          Start over
        </Button>
        {/* the address holds the setup once the server has run it; before that a link would show an older one */}
        {form.server.current && <CopyLinkButton label="Copy link to this setup" />}
        <p className="basis-full text-xs text-muted">
          Results update as you type. Diagnose has the server recompute them and puts the setup in the address bar to share.
        </p>
      </div>
    </form>
  );
}
