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
    },
    scope: {
      attenuationSetting: scope.attenuationSetting,
      inputResistanceOhm: scope.inputResistanceOhm,
      inputCapacitanceF: scope.inputCapacitanceF,
      bandwidthHz: scope.bandwidthHz,
      bandwidthLimitHz: scope.bandwidthLimitOn ? scope.bandwidthLimitHz : undefined,
    },
    circuit: { sourceResistanceOhm: setup?.circuit?.sourceResistanceOhm },
    signal: setup?.signal ?? {},
    observed,
  };
}
