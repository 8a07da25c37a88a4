import { useState } from 'react';
import { useWatch } from 'react-hook-form';
import { describeSetting, settingConflicts, settingProposals, type ScopeKey, type SettingProposal } from '../../../../shared/capture/case-fill';
import { inSentence } from '../../../../shared/diagnosis/wording';
import type { Attachment } from '../../../../shared/schemas/case';
import { Button } from '../../../components/ui/Button';
import { ConfirmDialog } from '../../../components/ui/Dialog';
import { readQuantity, showQuantity, type QuantityUnit } from '../../../lib/quantity';
import type { CaseFormApi } from '../form/case-form-schema';

const UNITS: Partial<Record<ScopeKey, QuantityUnit>> = { attenuationSetting: 'x', voltsPerDiv: 'V', offsetV: 'V', sampleRateHz: 'Hz', bandwidthLimitHz: 'Hz' };

/** What the form field gets: quantity text, the coupling's value, or the resistance as a plain number. */
function fieldValue(p: SettingProposal): string {
  if (typeof p.value === 'string') return p.value;
  const unit = UNITS[p.field];
  return unit ? showQuantity(p.value, unit, 4) : String(p.value);
}

/** The form's text read back to SI, so a conflict is judged on values, not spellings. */
function recorded(field: ScopeKey, text: unknown): number | 'dc' | 'ac' | undefined {
  if (text === '' || text === undefined || text === null) return undefined;
  if (field === 'coupling') return text === 'dc' || text === 'ac' ? text : undefined;
  const unit = UNITS[field];
  if (!unit) return Number.isFinite(Number(text)) ? Number(text) : undefined;
  const read = readQuantity(String(text), unit);
  return read.kind === 'ok' ? read.value : undefined;
}

/**
 * The settings a capture file recorded (the channel's attenuation setting, V/div, offset,
 * sample rate, coupling, bandwidth limit, input resistance), shown against the form's setup:
 * a conflict (the file says 1X, the case says 10X) in amber, and on request filled into the
 * setup after a confirmation that lists what changes. Fields the form does not have are left out.
 */
export function FillSetupFromCapture({ form, capture }: { form: CaseFormApi; capture: Attachment }) {
  const [open, setOpen] = useState(false);
  const scopeText = useWatch({ control: form.control, name: 'setup.scope' }) as unknown as Record<string, unknown>;
  const analysis = capture.analysis ?? {};
  const proposals = settingProposals(analysis).filter((p) => p.field in scopeText);
  if (proposals.length === 0) return null;
  const scope = Object.fromEntries(proposals.map((p) => [p.field, recorded(p.field, scopeText[p.field])]));
  const conflicts = settingConflicts(analysis, scope);
  const changes = proposals.filter((p) => scope[p.field] === undefined || conflicts.some((c) => c.field === p.field));
  const apply = () => {
    const set = form.setValue as unknown as (name: string, value: unknown, options: object) => void;
    for (const p of changes) set(`setup.scope.${p.field}`, fieldValue(p), { shouldDirty: true, shouldValidate: true, shouldTouch: true });
    setOpen(false);
  };
  return (
    <section aria-label={`Settings from ${capture.originalName}`} className="flex flex-col gap-2 rounded-md border border-dashed border-rule px-3 py-2 text-sm">
      <div className="flex flex-wrap items-center justify-between gap-x-4 gap-y-2">
        <p className="min-w-0">
          <span className="font-mono text-xs">{capture.originalName}</span> records{' '}
          {proposals.map((p, i) => (
            <span key={p.field}>
              {i > 0 && ', '}
              {inSentence(p.label)} <span className="font-mono">{describeSetting(p.field, p.value)}</span>
            </span>
          ))}
          .
        </p>
        {changes.length > 0 ? (
          <Button type="button" variant="secondary" className="px-3! py-1.5!" onClick={() => setOpen(true)}>
            Fill the setup from this file
          </Button>
        ) : (
          <p className="text-xs text-agree">The setup matches the file's settings.</p>
        )}
      </div>
      {conflicts.length > 0 && (
        <ul role="alert" aria-label="Setup conflicts with the capture file" className="rounded-md border border-caution/60 bg-caution-soft px-3 py-2 text-caution">
          {conflicts.map((c) => (
            <li key={c.field}>{c.message} An exported capture records the channel's setting, not the probe that was on it.</li>
          ))}
        </ul>
      )}
      <ConfirmDialog open={open} title="Fill the setup from the capture file?" confirmLabel={`Fill ${changes.length === 1 ? 'this setting' : `these ${changes.length} settings`}`} onConfirm={apply} onCancel={() => setOpen(false)}>
        <p>From the preamble of <span className="font-mono">{capture.originalName}</span>. Recorded values that differ are replaced; check them against what was really on the bench.</p>
        <table className="mt-3 w-full text-left text-sm">
          <thead className="text-xs text-muted">
            <tr>
              <th className="py-1 font-normal">Setting</th>
              <th className="py-1 font-normal">Now</th>
              <th className="py-1 font-normal">From the file</th>
            </tr>
          </thead>
          <tbody>
            {proposals.map((p) => (
              <tr key={p.field} className="border-t border-rule">
                <th scope="row" className="py-1 pr-2 font-normal">
                  {p.label}
                </th>
                <td className="py-1 pr-2 font-mono">{(scopeText[p.field] as string) || <span className="font-sans text-muted">empty</span>}</td>
                <td className={`py-1 font-mono ${changes.includes(p) ? 'font-semibold' : 'text-muted'}`}>{describeSetting(p.field, p.value)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </ConfirmDialog>
    </section>
  );
}
