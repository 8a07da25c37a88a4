import { SelectField, TextField } from '../../../components/ui/Field';
import { GROUND_KINDS, type GroundKind } from '../../../../shared/schemas/diagnosis';
import type { CaseFormApi } from '../form/case-form-schema';
import { FieldGroup, FormSection } from './FormSection';
import { FormQuantity } from './FormQuantity';

const GROUND_LABELS: Record<GroundKind, string> = { 'clip-lead': 'Clip lead', spring: 'Short spring', none: 'None' };
const groundOptions = [{ value: '', label: 'Not recorded' }, ...GROUND_KINDS.map((k) => ({ value: k, label: GROUND_LABELS[k] }))];
const inputROptions = [
  { value: '', label: 'Not recorded' },
  { value: '1000000', label: '1 MΩ' },
  { value: '50', label: '50 Ω' },
];
const yesNo = [
  { value: '', label: 'Not recorded' },
  { value: 'yes', label: 'Yes' },
  { value: 'no', label: 'No' },
];

function Check({ form, name, label }: { form: CaseFormApi; name: 'setup.probe.switchable' | 'setup.scope.bandwidthLimitOn'; label: string }) {
  return (
    <label className="flex items-center gap-2 self-end py-2 text-sm font-semibold">
      <input type="checkbox" className="h-4 w-4 accent-[var(--ft-ink)]" {...form.register(name)} />
      {label}
    </label>
  );
}

export function SetupSection({ form }: { form: CaseFormApi }) {
  const switchable = form.watch('setup.probe.switchable');
  const limitOn = form.watch('setup.scope.bandwidthLimitOn');
  const ground = form.watch('setup.probe.groundKind');
  const currentR = form.watch('setup.scope.inputResistanceOhm');
  const rOptions = currentR && !inputROptions.some((o) => o.value === currentR) ? [...inputROptions, { value: currentR, label: `${currentR} Ω` }] : inputROptions;
  const { errors } = form.formState;
  return (
    <FormSection id="setup" title="Setup" lead="Values take engineering notation: 15 pF, 9 MΩ or 9Meg, 120 MHz, 2.5 ns, 500m. Leave out what you did not record.">
      <FieldGroup legend="Probe">
        <TextField label="Probe model" placeholder="e.g. passive 10x, 200 MHz" {...form.register('setup.probe.model')} error={errors.setup?.probe?.model?.message} />
        <FormQuantity form={form} name="setup.probe.nominalAttenuation" label="Nominal attenuation" unit="x" placeholder="10x" hint="The ratio printed on the probe." />
        <Check form={form} name="setup.probe.switchable" label="Switchable (1x / 10x)" />
        {switchable && (
          <FormQuantity form={form} name="setup.probe.attenuation" label="Switch position" unit="x" placeholder="1x" hint="Where the switch actually was; scopes usually cannot sense it." />
        )}
        <FormQuantity form={form} name="setup.probe.tipResistanceOhm" label="Tip resistance" unit="Ω" placeholder="9 MΩ" />
        <FormQuantity form={form} name="setup.probe.tipCapacitanceF" label="Tip capacitance" unit="F" placeholder="11 pF" hint="Data-sheet figure: what the circuit sees with the probe on its scope." />
        <FormQuantity form={form} name="setup.probe.bandwidthHz" label="Probe bandwidth" unit="Hz" placeholder="200 MHz" />
        <SelectField label="Ground connection" options={groundOptions} {...form.register('setup.probe.groundKind')} />
        {ground !== 'none' && <FormQuantity form={form} name="setup.probe.groundLeadM" label="Ground lead length" unit="m" placeholder="15 cm" />}
      </FieldGroup>
      <FieldGroup legend="Scope channel">
        <TextField label="Scope model" placeholder="e.g. 4-channel, 350 MHz" {...form.register('setup.scope.model')} error={errors.setup?.scope?.model?.message} />
        <FormQuantity form={form} name="setup.scope.attenuationSetting" label="Channel attenuation setting" unit="x" placeholder="1x" hint="What the channel was set to assume." />
        <SelectField label="Input resistance" options={rOptions} {...form.register('setup.scope.inputResistanceOhm')} />
        <FormQuantity form={form} name="setup.scope.inputCapacitanceF" label="Input capacitance" unit="F" placeholder="14 pF" />
        <FormQuantity form={form} name="setup.scope.bandwidthHz" label="Channel bandwidth" unit="Hz" placeholder="350 MHz" />
        <Check form={form} name="setup.scope.bandwidthLimitOn" label="Bandwidth limit on" />
        {limitOn && <FormQuantity form={form} name="setup.scope.bandwidthLimitHz" label="Bandwidth limit" unit="Hz" placeholder="20 MHz" />}
      </FieldGroup>
      <FieldGroup legend="Circuit">
        <FormQuantity form={form} name="setup.circuit.sourceResistanceOhm" label="Source impedance" unit="Ω" placeholder="50 Ω" />
        <TextField
          label="Node probed"
          placeholder="e.g. gate of Q3, after the 10 Ω gate resistor"
          {...form.register('setup.circuit.nodeDescription')}
          error={errors.setup?.circuit?.nodeDescription?.message}
        />
        <SelectField label="Mains-connected equipment" options={yesNo} {...form.register('setup.circuit.mainsConnected')} />
        <FormQuantity form={form} name="setup.circuit.highestVoltageV" label="Highest voltage present" unit="V" placeholder="12 V" hint="Anywhere a probe or lead could touch." />
      </FieldGroup>
    </FormSection>
  );
}
