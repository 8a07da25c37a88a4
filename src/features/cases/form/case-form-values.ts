import type { Case, CaseSetup } from '../../../../shared/schemas/case';
import { editableQuantity, readQuantity, type QuantityUnit } from '../../../lib/quantity';
import type { CaseFormValues } from './case-form-schema';

const q = (value: number | null | undefined, unit: QuantityUnit) => editableQuantity(value, unit);
const s = (value: string | null | undefined) => value ?? '';

/** A blank form for a new case. */
export function emptyCaseForm(): CaseFormValues {
  return caseToFormValues(null);
}

/**
 * The editor's values for a stored case (or a blank one). The engine's own tags are left out:
 * the form edits only the author's tags, and the server adds the engine's on every save.
 */
export function caseToFormValues(c: Pick<Case, 'title' | 'summary' | 'narrative' | 'setup' | 'statedCause' | 'statedCauseOther' | 'fix' | 'lessonSummary' | 'lessonDetail' | 'tags' | 'diagnosis'> | null): CaseFormValues {
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
      },
      scope: {
        model: s(scope.model),
        attenuationSetting: q(scope.attenuationSetting, 'x'),
        inputResistanceOhm: scope.inputResistanceOhm == null ? '' : String(scope.inputResistanceOhm),
        inputCapacitanceF: q(scope.inputCapacitanceF, 'F'),
        bandwidthHz: q(scope.bandwidthHz, 'Hz'),
        bandwidthLimitOn: scope.bandwidthLimitOn ?? false,
        bandwidthLimitHz: q(scope.bandwidthLimitHz, 'Hz'),
      },
      circuit: {
        sourceResistanceOhm: q(circuit.sourceResistanceOhm, 'Ω'),
        nodeDescription: s(circuit.nodeDescription),
        mainsConnected: circuit.mainsConnected == null ? '' : circuit.mainsConnected ? 'yes' : 'no',
        highestVoltageV: q(circuit.highestVoltageV, 'V'),
      },
      signal: {
        kind: signal.kind ?? '',
        expectedAmplitudeV: q(signal.expectedAmplitudeV, 'V'),
        frequencyHz: q(signal.frequencyHz, 'Hz'),
        riseTimeS: q(signal.riseTimeS, 's'),
      },
      observed: {
        amplitudeV: q(observed.amplitudeV, 'V'),
        riseTimeS: q(observed.riseTimeS, 's'),
        overshootPct: q(observed.overshootPct, '%'),
        ringingFrequencyHz: q(observed.ringingFrequencyHz, 'Hz'),
        description: s(observed.description),
      },
    },
    statedCause: c?.statedCause ?? '',
    statedCauseOther: s(c?.statedCauseOther),
    fix: s(c?.fix),
    lessonSummary: s(c?.lessonSummary),
    lessonDetail: s(c?.lessonDetail),
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
    },
    scope: {
      attenuationSetting: num(scope.attenuationSetting, 'x'),
      inputResistanceOhm: scope.inputResistanceOhm === '' ? undefined : Number(scope.inputResistanceOhm),
      inputCapacitanceF: num(scope.inputCapacitanceF, 'F'),
      bandwidthHz: num(scope.bandwidthHz, 'Hz'),
      bandwidthLimitOn: scope.bandwidthLimitOn,
      bandwidthLimitHz: num(scope.bandwidthLimitHz, 'Hz'),
    },
    circuit: {
      sourceResistanceOhm: num(circuit.sourceResistanceOhm, 'Ω'),
      mainsConnected: circuit.mainsConnected === 'yes',
      highestVoltageV: num(circuit.highestVoltageV, 'V'),
    },
    signal: {
      kind: signal.kind || undefined,
      expectedAmplitudeV: num(signal.expectedAmplitudeV, 'V'),
      frequencyHz: num(signal.frequencyHz, 'Hz'),
      riseTimeS: num(signal.riseTimeS, 's'),
    },
    observed: {
      amplitudeV: num(observed.amplitudeV, 'V'),
      riseTimeS: num(observed.riseTimeS, 's'),
      overshootPct: num(observed.overshootPct, '%'),
      ringingFrequencyHz: num(observed.ringingFrequencyHz, 'Hz'),
    },
  };
}
