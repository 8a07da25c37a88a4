import { useState } from 'react';
import { useWatch } from 'react-hook-form';
import type { Attachment } from '../../../../shared/schemas/case';
import { Button } from '../../../components/ui/Button';
import { ConfirmDialog } from '../../../components/ui/Dialog';
import { readQuantity, showQuantity, type QuantityUnit } from '../../../lib/quantity';
import type { CaseFormApi } from '../form/case-form-schema';

type ObservedField = 'amplitudeV' | 'riseTimeS' | 'overshootPct' | 'ringingFrequencyHz';

interface Proposal {
  field: ObservedField;
  label: string;
  unit: QuantityUnit;
  /** What the capture measured; null when it has no such feature (the field is left alone). */
  value: number | null;
  note?: string;
}

const numberAt = (a: Record<string, unknown>, key: string) => (typeof a[key] === 'number' && Number.isFinite(a[key]) ? (a[key] as number) : null);

/** The observed fields a capture's stored analysis can fill, in the form's order. */
function proposalsOf(analysis: Record<string, unknown>): Proposal[] {
  const rise = numberAt(analysis, 'riseTimeS');
  const fall = numberAt(analysis, 'fallTimeS');
  return [
    { field: 'amplitudeV', label: 'Observed amplitude', unit: 'V', value: numberAt(analysis, 'amplitudeV') },
    // the engine reads this field as the transition time shown, so a falls-only capture still informs it
    { field: 'riseTimeS', label: 'Observed rise time', unit: 's', value: rise ?? fall, note: rise === null && fall !== null ? 'fall time: the capture has no rising edge' : undefined },
    { field: 'overshootPct', label: 'Overshoot', unit: '%', value: numberAt(analysis, 'overshootPct') },
    { field: 'ringingFrequencyHz', label: 'Ringing frequency', unit: 'Hz', value: numberAt(analysis, 'ringingFrequencyHz') },
  ];
}

/** The text a field gets: four significant figures, enough for a measurement and easy to read. */
const fieldText = (value: number, unit: QuantityUnit) => showQuantity(value, unit, 4);

/** Whether the field already says (to four figures) what the capture measured. */
function same(text: string, p: Proposal): boolean {
  if (p.value === null) return true;
  const current = readQuantity(text, p.unit);
  return current.kind === 'ok' && fieldText(current.value, p.unit) === fieldText(p.value, p.unit);
}

/**
 * Offers to copy what a capture measured into the observed fields. Nothing changes until the
 * author confirms, and fields the capture has nothing for keep what was typed.
 */
export function FillObservedFromCapture({ form, capture }: { form: CaseFormApi; capture: Attachment }) {
  const [open, setOpen] = useState(false);
  const observed = useWatch({ control: form.control, name: 'setup.observed' });
  const proposals = proposalsOf(capture.analysis ?? {});
  const measured = proposals.filter((p) => p.value !== null);
  if (measured.length === 0) return null;
  const changes = measured.filter((p) => !same(observed[p.field], p));
  const apply = () => {
    for (const p of changes) form.setValue(`setup.observed.${p.field}`, fieldText(p.value!, p.unit), { shouldDirty: true, shouldValidate: true, shouldTouch: true });
    setOpen(false);
  };
  return (
    <section aria-label={`Observed values from ${capture.originalName}`} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-2 rounded-md border border-dashed border-rule px-3 py-2 text-sm">
      <p className="min-w-0">
        <span className="font-mono text-xs">{capture.originalName}</span> measured{' '}
        {proposals.map((p, i) => (
          <span key={p.field}>
            {i > 0 && ', '}
            {p.label.replace(/^Observed /, '').toLowerCase()} <span className="font-mono">{p.value === null ? 'none' : fieldText(p.value, p.unit)}</span>
          </span>
        ))}
        .
      </p>
      {changes.length > 0 ? (
        <Button type="button" variant="secondary" className="px-3! py-1.5!" onClick={() => setOpen(true)}>
          Fill the observed values from this capture
        </Button>
      ) : (
        <p className="text-xs text-agree">The observed values match this capture.</p>
      )}
      <ConfirmDialog open={open} title="Fill the observed values from this capture?" confirmLabel={`Fill ${changes.length === 1 ? 'this value' : `these ${changes.length} values`}`} onConfirm={apply} onCancel={() => setOpen(false)}>
        <p>
          From <span className="font-mono">{capture.originalName}</span>, as measured when it was attached. The live diagnosis reruns with them; you can still edit each field.
        </p>
        <table className="mt-3 w-full text-left text-sm">
          <thead className="text-xs text-muted">
            <tr>
              <th className="py-1 font-normal">Field</th>
              <th className="py-1 font-normal">Now</th>
              <th className="py-1 font-normal">From the capture</th>
            </tr>
          </thead>
          <tbody>
            {proposals.map((p) => {
              const changing = changes.includes(p);
              return (
                <tr key={p.field} className="border-t border-rule">
                  <th scope="row" className="py-1 pr-2 font-normal">
                    {p.label}
                  </th>
                  <td className="py-1 pr-2 font-mono">{observed[p.field] || <span className="font-sans text-muted">empty</span>}</td>
                  <td className={`py-1 font-mono ${changing ? 'font-semibold' : 'text-muted'}`}>
                    {p.value === null ? <span className="font-sans">not in the capture (kept)</span> : fieldText(p.value, p.unit)}
                    {p.note && <span className="block font-sans text-xs font-normal text-muted">{p.note}</span>}
                    {p.value !== null && !changing && <span className="font-sans text-xs font-normal"> (same)</span>}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </ConfirmDialog>
    </section>
  );
}
