import { useState } from 'react';
import { useWatch } from 'react-hook-form';
import { observedProposals, type ObservedKey, type ObservedProposal } from '../../../../shared/capture/case-fill';
import { inSentence } from '../../../../shared/diagnosis/wording';
import type { Attachment } from '../../../../shared/schemas/case';
import { Button } from '../../../components/ui/Button';
import { ConfirmDialog } from '../../../components/ui/Dialog';
import { readQuantity, showQuantity, type QuantityUnit } from '../../../lib/quantity';
import type { CaseFormApi } from '../form/case-form-schema';

const UNITS: Record<ObservedKey, QuantityUnit | null> = {
  amplitudeV: 'V',
  riseTimeS: 's',
  overshootPct: '%',
  ringingFrequencyHz: 'Hz',
  frequencyHz: 'Hz',
  clipped: null,
  tiltPct: '%',
  humFrequencyHz: 'Hz',
};

/**
 * The text a field gets: four significant figures for a quantity, enough for a measurement and
 * easy to read; the clipped select's 'yes' / 'no' for a yes-or-no reading.
 */
const fieldValue = (p: ObservedProposal): string => (typeof p.value === 'boolean' ? (p.value ? 'yes' : 'no') : showQuantity(p.value as number, UNITS[p.field]!, 4));
const shown = (p: ObservedProposal) => (p.value === null ? 'none' : fieldValue(p));

/** Whether the field already says (to four figures) what the capture measured. */
function same(current: unknown, p: ObservedProposal): boolean {
  if (p.value === null) return true;
  if (typeof p.value === 'boolean') return current === fieldValue(p);
  const unit = UNITS[p.field]!;
  const read = readQuantity(typeof current === 'string' ? current : '', unit);
  return read.kind === 'ok' && showQuantity(read.value, unit, 4) === fieldValue(p);
}

/**
 * Offers to copy what a capture measured into every observed field the engine reads (amplitude,
 * rise time, overshoot, ringing, frequency, clipping, tilt, hum). Nothing changes until the author
 * confirms; fields the capture has nothing for keep what was typed; a field the form does not
 * have yet is listed and left out.
 */
export function FillObservedFromCapture({ form, capture }: { form: CaseFormApi; capture: Attachment }) {
  const [open, setOpen] = useState(false);
  const observed = useWatch({ control: form.control, name: 'setup.observed' }) as unknown as Record<string, unknown>;
  const proposals = observedProposals(capture.analysis ?? {});
  const inForm = proposals.filter((p) => p.field in observed);
  const measured = inForm.filter((p) => p.value !== null);
  if (measured.length === 0) return null;
  const changes = measured.filter((p) => !same(observed[p.field], p));
  const overwrites = changes.filter((p) => observed[p.field] !== '' && observed[p.field] !== undefined && observed[p.field] !== null);
  const apply = () => {
    const set = form.setValue as unknown as (name: string, value: unknown, options: object) => void;
    for (const p of changes) set(`setup.observed.${p.field}`, fieldValue(p), { shouldDirty: true, shouldValidate: true, shouldTouch: true });
    setOpen(false);
  };
  return (
    <section aria-label={`Observed values from ${capture.originalName}`} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-2 rounded-md border border-dashed border-rule px-3 py-2 text-sm">
      <p className="min-w-0">
        <span className="font-mono text-xs">{capture.originalName}</span> measured{' '}
        {inForm.map((p, i) => (
          <span key={p.field}>
            {i > 0 && ', '}
            {inSentence(p.label.replace(/^Observed /, ''))} <span className="font-mono">{shown(p)}</span>
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
      <ConfirmDialog
        open={open}
        title={overwrites.length ? `Overwrite ${overwrites.length} observed value${overwrites.length === 1 ? '' : 's'}?` : 'Fill the observed values from this capture?'}
        confirmLabel={`Fill ${changes.length === 1 ? 'this value' : `these ${changes.length} values`}`}
        onConfirm={apply}
        onCancel={() => setOpen(false)}
      >
        <p>
          From <span className="font-mono">{capture.originalName}</span>, as measured on its analysed channel. The live diagnosis reruns with them; you can still edit each field.
          {overwrites.length > 0 && ' Fields you typed that differ are replaced.'}
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
            {inForm.map((p) => {
              const changing = changes.includes(p);
              const now = observed[p.field];
              return (
                <tr key={p.field} className="border-t border-rule">
                  <th scope="row" className="py-1 pr-2 font-normal">
                    {p.label}
                  </th>
                  <td className="py-1 pr-2 font-mono">{typeof now === 'boolean' ? (now ? 'yes' : 'no') : (now as string) || <span className="font-sans text-muted">empty</span>}</td>
                  <td className={`py-1 font-mono ${changing ? 'font-semibold' : 'text-muted'}`}>
                    {p.value === null ? <span className="font-sans">not in the capture (kept)</span> : shown(p)}
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
