import type { CaseSetup } from '../schemas/case';
import type { DiagnosisInput } from '../schemas/diagnosis';

/**
 * The engine's input from a case's recorded setup. The probe ratio in effect is the switch
 * position when one is recorded, else the nominal ratio; a bandwidth-limit filter counts only
 * when it was switched on.
 */
export function diagnosisInputFromSetup(setup: CaseSetup | undefined): DiagnosisInput {
  const probe = setup?.probe ?? {};
  const scope = setup?.scope ?? {};
  const circuit = setup?.circuit ?? {};
  const { description: _description, ...observed } = setup?.observed ?? {};
  return {
    probe: {
      attenuation: probe.attenuation ?? probe.nominalAttenuation,
      tipCapacitanceF: probe.tipCapacitanceF,
      groundLeadM: probe.groundLeadM,
      bandwidthHz: probe.bandwidthHz,
      tipResistanceOhm: probe.tipResistanceOhm,
      groundKind: probe.groundKind,
      groundWireRadiusM: probe.groundWireRadiusM,
      kind: probe.kind,
      cmrrDb: probe.cmrrDb,
    },
    scope: {
      attenuationSetting: scope.attenuationSetting,
      inputResistanceOhm: scope.inputResistanceOhm,
      inputCapacitanceF: scope.inputCapacitanceF,
      bandwidthHz: scope.bandwidthHz,
      bandwidthLimitHz: scope.bandwidthLimitOn ? scope.bandwidthLimitHz : undefined,
      coupling: scope.coupling,
      acCornerHz: scope.acCornerHz,
      sampleRateHz: scope.sampleRateHz,
      voltsPerDiv: scope.voltsPerDiv,
      offsetV: scope.offsetV,
      divisions: scope.divisions,
    },
    circuit: {
      sourceResistanceOhm: circuit.sourceResistanceOhm,
      loadResistanceOhm: circuit.loadResistanceOhm,
      referenceV: circuit.referenceV,
      highestVoltageV: circuit.highestVoltageV,
      mainsConnected: circuit.mainsConnected,
      mainsFrequencyHz: circuit.mainsFrequencyHz,
    },
    signal: setup?.signal ?? {},
    observed,
  };
}
