import { SelectField, TextField } from '../../../components/ui/Field';
import { COUPLINGS, GENERATOR_LOADS, GROUND_KINDS, PROBE_KINDS, type Coupling, type GeneratorLoad, type GroundKind, type ProbeKind } from '../../../../shared/schemas/diagnosis';
import type { CaseFormApi } from '../form/case-form-schema';
import { CollapsibleGroup, FieldGroup, FormSection } from './FormSection';
import { FormQuantity } from './FormQuantity';

const GROUND_LABELS: Record<GroundKind, string> = { 'clip-lead': 'Clip lead', spring: 'Short spring', none: 'None' };
const groundOptions = [{ value: '', label: 'Not recorded' }, ...GROUND_KINDS.map((k) => ({ value: k, label: GROUND_LABELS[k] }))];
const inputROptions = [
  { value: '', label: 'Not recorded' },
  { value: '1000000', label: '1 MΩ' },
  { value: '50', label: '50 Ω' },
];
const PROBE_KIND_LABELS: Record<ProbeKind, string> = { passive: 'Passive', active: 'Active (FET)', differential: 'Differential', current: 'Current probe' };
const COUPLING_LABELS: Record<Coupling, string> = { dc: 'DC', ac: 'AC' };
const GENERATOR_LABELS: Record<GeneratorLoad, string> = { '50-ohm': 'Set for a 50 Ω load', 'high-z': 'Set for high impedance' };
const notRecorded = { value: '', label: 'Not recorded' };
const probeKindOptions = [notRecorded, ...PROBE_KINDS.map((k) => ({ value: k, label: PROBE_KIND_LABELS[k] }))];
const couplingOptions = [notRecorded, ...COUPLINGS.map((k) => ({ value: k, label: COUPLING_LABELS[k] }))];
const generatorOptions = [notRecorded, ...GENERATOR_LOADS.map((k) => ({ value: k, label: GENERATOR_LABELS[k] }))];
const filled = (...values: (string | undefined)[]) => values.some((v) => (v ?? '').trim() !== '');

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
  const scope = form.watch('setup.scope');
  const probe = form.watch('setup.probe');
  const circuit = form.watch('setup.circuit');
  const signal = form.watch('setup.signal');
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
      <CollapsibleGroup
        legend="Acquisition"
        lead="sample rate, vertical scale, coupling, rise time"
        filled={filled(scope.sampleRateHz, scope.voltsPerDiv, scope.offsetV, scope.divisions, scope.coupling, scope.acCornerHz, scope.riseTimeS)}
      >
        <FormQuantity form={form} name="setup.scope.sampleRateHz" label="Sample rate" unit="Sa/s" placeholder="1 GSa/s" hint="What the scope really sampled at this timebase." />
        <FormQuantity form={form} name="setup.scope.voltsPerDiv" label="Vertical scale" unit="V/div" placeholder="500 mV/div" />
        <FormQuantity form={form} name="setup.scope.offsetV" label="Offset" unit="V" placeholder="0 V" hint="Input voltage at the screen's centre line." />
        <FormQuantity form={form} name="setup.scope.divisions" label="Vertical divisions" unit="#" placeholder="8" hint="Blank for the usual 8." />
        <SelectField label="Coupling" options={couplingOptions} {...form.register('setup.scope.coupling')} />
        {scope.coupling === 'ac' && (
          <FormQuantity form={form} name="setup.scope.acCornerHz" label="AC-coupling corner" unit="Hz" placeholder="10 Hz" hint="Data-sheet figure with a low-impedance source." />
        )}
        <FormQuantity form={form} name="setup.scope.riseTimeS" label="Scope rise time" unit="s" placeholder="1.2 ns" hint="Only when the data sheet gives one." />
      </CollapsibleGroup>
      <CollapsibleGroup
        legend="Grounding and reference"
        lead="probe kind, CMRR, reference node, mains frequency"
        filled={filled(probe.kind, probe.cmrrDb, circuit.referenceV, circuit.mainsFrequencyHz)}
      >
        <SelectField label="Probe kind" options={probeKindOptions} {...form.register('setup.probe.kind')} />
        {probe.kind === 'differential' && (
          <FormQuantity form={form} name="setup.probe.cmrrDb" label="Probe CMRR" unit="dB" placeholder="60 dB" hint="Common-mode rejection at the signal frequency." />
        )}
        <FormQuantity
          form={form}
          name="setup.circuit.referenceV"
          label="Reference node voltage"
          unit="V"
          placeholder="0 V"
          hint="Peak voltage from earth of the node the probe's ground or reference lead is on."
        />
        <FormQuantity form={form} name="setup.circuit.mainsFrequencyHz" label="Mains frequency" unit="Hz" placeholder="50 Hz" />
      </CollapsibleGroup>
      <CollapsibleGroup legend="Source" lead="what the source drives, generator setting, low level" filled={filled(circuit.loadResistanceOhm, signal.generatorLoad, signal.baseV)}>
        <FormQuantity form={form} name="setup.circuit.loadResistanceOhm" label="Load resistance" unit="Ω" placeholder="1 MΩ" hint="What the source really drives." />
        <SelectField label="Generator load setting" options={generatorOptions} hint="The load the generator's amplitude setting assumes." {...form.register('setup.signal.generatorLoad')} />
        <FormQuantity form={form} name="setup.signal.baseV" label="Signal low level" unit="V" placeholder="0 V" hint="Blank for 0 V (a sine: −A/2)." />
      </CollapsibleGroup>
    </FormSection>
  );
}
