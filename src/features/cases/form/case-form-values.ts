import type { Case, CaseSetup } from '../../../../shared/schemas/case';
import { editableQuantity, readQuantity, type QuantityUnit } from '../../../lib/quantity';
import type { CaseFormValues } from './case-form-schema';

const q = (value: number | null | undefined, unit: QuantityUnit) => editableQuantity(value, unit);
const s = (value: string | null | undefined) => value ?? '';
const yn = (value: boolean | null | undefined): '' | 'yes' | 'no' => (value == null ? '' : value ? 'yes' : 'no');

/** A blank form for a new case. */
export function emptyCaseForm(): CaseFormValues {
  return caseToFormValues(null);
}

/**
 * The editor's values for a stored case (or a blank one). The engine's own tags are left out:
 * the form edits only the author's tags, and the server adds the engine's on every save.
 */
export function caseToFormValues(c: Pick<Case, 'title' | 'summary' | 'narrative' | 'setup' | 'statedCause' | 'statedCauseOther' | 'fix' | 'lessonSummary' | 'lessonDetail' | 'safetyNote' | 'tags' | 'diagnosis'> | null): CaseFormValues {
  const setup: CaseSetup = c?.setup ?? {};
  const probe = setup.probe ?? {};
  const scope = setup.scope ?? {};
  const circuit = setup.circuit ?? {};
  const signal = setup.signal ?? {};
  const observed = setup.observed ?? {};
  const engineTags = new Set(c?.diagnosis?.tags ?? []);
  return {
    title: s(c?.title),
    summary: s(c?.summary),
    narrative: s(c?.narrative),
    setup: {
      probe: {
        model: s(probe.model),
        nominalAttenuation: q(probe.nominalAttenuation, 'x'),
        switchable: probe.switchable ?? false,
        attenuation: q(probe.attenuation, 'x'),
        tipResistanceOhm: q(probe.tipResistanceOhm, 'Ω'),
        tipCapacitanceF: q(probe.tipCapacitanceF, 'F'),
        bandwidthHz: q(probe.bandwidthHz, 'Hz'),
        groundKind: probe.groundKind ?? '',
        groundLeadM: q(probe.groundLeadM, 'm'),
        groundWireRadiusM: q(probe.groundWireRadiusM, 'm'),
        kind: probe.kind ?? '',
        cmrrDb: q(probe.cmrrDb, 'dB'),
      },
      scope: {
        model: s(scope.model),
        attenuationSetting: q(scope.attenuationSetting, 'x'),
        inputResistanceOhm: scope.inputResistanceOhm == null ? '' : String(scope.inputResistanceOhm),
        inputCapacitanceF: q(scope.inputCapacitanceF, 'F'),
        bandwidthHz: q(scope.bandwidthHz, 'Hz'),
        bandwidthLimitOn: scope.bandwidthLimitOn ?? false,
        bandwidthLimitHz: q(scope.bandwidthLimitHz, 'Hz'),
        riseTimeS: q(scope.riseTimeS, 's'),
        coupling: scope.coupling ?? '',
        acCornerHz: q(scope.acCornerHz, 'Hz'),
        sampleRateHz: q(scope.sampleRateHz, 'Sa/s'),
        voltsPerDiv: q(scope.voltsPerDiv, 'V/div'),
        offsetV: q(scope.offsetV, 'V'),
        divisions: q(scope.divisions, '#'),
      },
      circuit: {
        sourceResistanceOhm: q(circuit.sourceResistanceOhm, 'Ω'),
        nodeDescription: s(circuit.nodeDescription),
        mainsConnected: yn(circuit.mainsConnected),
        highestVoltageV: q(circuit.highestVoltageV, 'V'),
        loadResistanceOhm: q(circuit.loadResistanceOhm, 'Ω'),
        referenceV: q(circuit.referenceV, 'V'),
        mainsFrequencyHz: q(circuit.mainsFrequencyHz, 'Hz'),
      },
      signal: {
        kind: signal.kind ?? '',
        expectedAmplitudeV: q(signal.expectedAmplitudeV, 'V'),
        frequencyHz: q(signal.frequencyHz, 'Hz'),
        riseTimeS: q(signal.riseTimeS, 's'),
        baseV: q(signal.baseV, 'V'),
        generatorLoad: signal.generatorLoad ?? '',
      },
      observed: {
        amplitudeV: q(observed.amplitudeV, 'V'),
        riseTimeS: q(observed.riseTimeS, 's'),
        overshootPct: q(observed.overshootPct, '%'),
        ringingFrequencyHz: q(observed.ringingFrequencyHz, 'Hz'),
        frequencyHz: q(observed.frequencyHz, 'Hz'),
        clipped: yn(observed.clipped),
        tiltPct: q(observed.tiltPct, '%'),
        humFrequencyHz: q(observed.humFrequencyHz, 'Hz'),
        description: s(observed.description),
      },
    },
    statedCause: c?.statedCause ?? '',
    statedCauseOther: s(c?.statedCauseOther),
    fix: s(c?.fix),
    lessonSummary: s(c?.lessonSummary),
    lessonDetail: s(c?.lessonDetail),
    safetyNote: s(c?.safetyNote),
    tags: (c?.tags ?? []).filter((t) => !engineTags.has(t)),
  };
}

const num = (text: string | undefined, unit: QuantityUnit) => {
  const r = readQuantity(text ?? '', unit);
  return r.kind === 'ok' ? r.value : undefined;
};

/**
 * The setup as far as it can be read right now, for the live diagnosis: a field that does not
 * parse yet is simply left out instead of blocking the whole panel.
 */
export function readableSetup(v: CaseFormValues): CaseSetup {
  const { probe, scope, circuit, signal, observed } = v.setup;
  return {
    probe: {
      nominalAttenuation: num(probe.nominalAttenuation, 'x'),
      attenuation: probe.switchable ? num(probe.attenuation, 'x') : undefined,
      switchable: probe.switchable,
      tipResistanceOhm: num(probe.tipResistanceOhm, 'Ω'),
      tipCapacitanceF: num(probe.tipCapacitanceF, 'F'),
      bandwidthHz: num(probe.bandwidthHz, 'Hz'),
      groundKind: probe.groundKind || undefined,
      groundLeadM: num(probe.groundLeadM, 'm'),
      groundWireRadiusM: num(probe.groundWireRadiusM, 'm'),
      kind: probe.kind || undefined,
      cmrrDb: num(probe.cmrrDb, 'dB'),
    },
    scope: {
      attenuationSetting: num(scope.attenuationSetting, 'x'),
      inputResistanceOhm: scope.inputResistanceOhm === '' ? undefined : Number(scope.inputResistanceOhm),
      inputCapacitanceF: num(scope.inputCapacitanceF, 'F'),
      bandwidthHz: num(scope.bandwidthHz, 'Hz'),
      bandwidthLimitOn: scope.bandwidthLimitOn,
      bandwidthLimitHz: num(scope.bandwidthLimitHz, 'Hz'),
      riseTimeS: num(scope.riseTimeS, 's'),
      coupling: scope.coupling || undefined,
      acCornerHz: scope.coupling === 'ac' ? num(scope.acCornerHz, 'Hz') : undefined,
      sampleRateHz: num(scope.sampleRateHz, 'Sa/s'),
      voltsPerDiv: num(scope.voltsPerDiv, 'V/div'),
      offsetV: num(scope.offsetV, 'V'),
      divisions: num(scope.divisions, '#'),
    },
    circuit: {
      sourceResistanceOhm: num(circuit.sourceResistanceOhm, 'Ω'),
      mainsConnected: circuit.mainsConnected === '' ? undefined : circuit.mainsConnected === 'yes',
      highestVoltageV: num(circuit.highestVoltageV, 'V'),
      loadResistanceOhm: num(circuit.loadResistanceOhm, 'Ω'),
      referenceV: num(circuit.referenceV, 'V'),
      mainsFrequencyHz: num(circuit.mainsFrequencyHz, 'Hz'),
    },
    signal: {
      kind: signal.kind || undefined,
      expectedAmplitudeV: num(signal.expectedAmplitudeV, 'V'),
      frequencyHz: num(signal.frequencyHz, 'Hz'),
      riseTimeS: num(signal.riseTimeS, 's'),
      baseV: num(signal.baseV, 'V'),
      generatorLoad: signal.generatorLoad || undefined,
    },
    observed: {
      amplitudeV: num(observed.amplitudeV, 'V'),
      riseTimeS: num(observed.riseTimeS, 's'),
      overshootPct: num(observed.overshootPct, '%'),
      ringingFrequencyHz: num(observed.ringingFrequencyHz, 'Hz'),
      frequencyHz: num(observed.frequencyHz, 'Hz'),
      clipped: observed.clipped === '' ? undefined : observed.clipped === 'yes',
      tiltPct: num(observed.tiltPct, '%'),
      humFrequencyHz: num(observed.humFrequencyHz, 'Hz'),
    },
  };
}
