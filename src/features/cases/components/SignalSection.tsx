import { SelectField } from '../../../components/ui/Field';
import { TextAreaField } from '../../../components/ui/TextAreaField';
import { SIGNAL_KINDS, type SignalKind } from '../../../../shared/schemas/diagnosis';
import type { CaseFormApi } from '../form/case-form-schema';
import { FieldGroup, FormSection } from './FormSection';
import { FormQuantity } from './FormQuantity';

const KIND_LABELS: Record<SignalKind, string> = { square: 'Square wave', sine: 'Sine wave', pulse: 'Pulse / single edge', dc: 'DC level', other: 'Other' };
const clippedOptions = [
  { value: '', label: 'Not recorded' },
  { value: 'yes', label: 'Yes: tops or bottoms cut off' },
  { value: 'no', label: 'No: the whole trace on screen' },
];
const kindOptions = [{ value: '', label: 'Not recorded' }, ...SIGNAL_KINDS.map((k) => ({ value: k, label: KIND_LABELS[k] }))];

export function SignalSection({ form }: { form: CaseFormApi }) {
  const kind = form.watch('setup.signal.kind');
  const { errors } = form.formState;
  return (
    <FormSection id="signal" title="Signal and observation" lead="What the circuit really does, and what the scope showed.">
      <FieldGroup legend="Expected signal">
        <SelectField label="Kind" options={kindOptions} {...form.register('setup.signal.kind')} />
        <FormQuantity form={form} name="setup.signal.expectedAmplitudeV" label="Amplitude" unit="V" placeholder="3.3 V" />
        {kind !== 'dc' && <FormQuantity form={form} name="setup.signal.frequencyHz" label="Frequency" unit="Hz" placeholder="1 MHz" hint="Leave empty for DC." />}
        {kind !== 'dc' && kind !== 'sine' && <FormQuantity form={form} name="setup.signal.riseTimeS" label="Rise time" unit="s" placeholder="2.5 ns" />}
      </FieldGroup>
      <FieldGroup legend="Observed on the scope">
        <FormQuantity form={form} name="setup.observed.amplitudeV" label="Observed amplitude" unit="V" placeholder="0.33 V" />
        <FormQuantity form={form} name="setup.observed.riseTimeS" label="Observed rise time" unit="s" placeholder="8 ns" />
        <FormQuantity form={form} name="setup.observed.overshootPct" label="Overshoot" unit="%" placeholder="25 %" hint="Negative for undershoot." />
        <FormQuantity form={form} name="setup.observed.ringingFrequencyHz" label="Ringing frequency" unit="Hz" placeholder="180 MHz" />
        <FormQuantity form={form} name="setup.observed.frequencyHz" label="Observed frequency" unit="Hz" placeholder="1 MHz" hint="The repetition rate the scope showed." />
        <FormQuantity form={form} name="setup.observed.tiltPct" label="Tilt" unit="%" placeholder="12 %" hint="Droop across a flat top, % of the step." />
        <FormQuantity form={form} name="setup.observed.humFrequencyHz" label="Hum frequency" unit="Hz" placeholder="50 Hz" />
        <SelectField label="Clipped at the screen edge" options={clippedOptions} {...form.register('setup.observed.clipped')} />
        <div className="sm:col-span-2">
          <TextAreaField
            label="What the trace looked like"
            rows={3}
            placeholder="e.g. clean edges but a tenth of the amplitude; no ringing"
            {...form.register('setup.observed.description')}
            error={errors.setup?.observed?.description?.message}
          />
        </div>
      </FieldGroup>
    </FormSection>
  );
}
