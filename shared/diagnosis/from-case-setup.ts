import type { CaseSetup } from '../schemas/case';
import type { DiagnosisInput } from '../schemas/diagnosis';

/**
 * The engine's input from a case's recorded setup: every engine field the case records,
 * without the words an engineer adds (models, descriptions). The probe ratio in effect is the
 * switch position when one is recorded, else the nominal ratio; a bandwidth-limit filter
 * counts only when it was switched on.
 */
export function diagnosisInputFromSetup(setup: CaseSetup | undefined): DiagnosisInput {
  const { model: _probeModel, nominalAttenuation, switchable: _switchable, ...probe } = setup?.probe ?? {};
  const { model: _scopeModel, bandwidthLimitOn, bandwidthLimitHz, ...scope } = setup?.scope ?? {};
  const { nodeDescription: _node, ...circuit } = setup?.circuit ?? {};
  const { description: _description, ...observed } = setup?.observed ?? {};
  return {
    probe: { ...probe, attenuation: probe.attenuation ?? nominalAttenuation },
    scope: { ...scope, bandwidthLimitHz: bandwidthLimitOn ? bandwidthLimitHz : undefined },
    circuit,
    signal: setup?.signal ?? {},
    observed,
  };
}
