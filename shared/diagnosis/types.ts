import type { Cause, GroundKind, Predicted, Risk, SignalKind } from '../schemas/diagnosis';

/** The recorded setup with every gap filled from `defaults.ts`; SI units throughout. */
export interface ResolvedSetup {
  /** The probe's actual ratio. */
  probeAttenuation: number;
  /** The ratio the channel multiplies by. */
  channelSetting: number;
  tipResistanceOhm: number;
  /** Total capacitance at the tip with the probe on its scope. */
  tipCapacitanceF: number;
  probeBandwidthHz?: number;
  groundKind: GroundKind;
  /** Undefined when there is no probe ground and no length was given. */
  groundLeadM?: number;
  groundWireRadiusM: number;
  scopeInputResistanceOhm: number;
  scopeInputCapacitanceF: number;
  scopeBandwidthHz?: number;
  bandwidthLimitHz?: number;
  sourceResistanceOhm: number;
  expectedAmplitudeV?: number;
  /** Undefined means DC, or a single edge. */
  frequencyHz?: number;
  signalRiseTimeS?: number;
  signalKind: SignalKind;
  /** The signal has edges that can ring, overshoot or be rounded. */
  hasEdges: boolean;
  /** Names of fields the engine filled in, e.g. "probe.groundLeadM". */
  assumed: ReadonlySet<string>;
}

/** What was read off the screen, with null and absent both meaning "not observed". */
export interface Observed {
  amplitudeV?: number;
  riseTimeS?: number;
  overshootPct?: number;
  ringingFrequencyHz?: number;
}

export interface ModelContext {
  setup: ResolvedSetup;
  observed: Observed;
}

/**
 * One way a cause could explain the trace. A model offers a `recorded` candidate (the setup
 * as written) and, where the observation allows, a `fitted` one with one unrecorded
 * parameter inferred from it (a switch position, a source impedance, a lead length).
 */
export interface Candidate {
  cause: Cause;
  basis: 'recorded' | 'fitted';
  /** For fitted candidates: how often such an unrecorded parameter is the culprit (0–1). */
  hiddenPrior?: number;
  /**
   * Size of the error this candidate predicts on the screen, in natural-log units
   * (ln 10 ≈ 2.3 for a factor of ten); ranks hypotheses when nothing is observed.
   */
  deviation: number;
  /** Quantities this model predicts; the ranker fills the rest with the reference picture. */
  predicted: Predicted;
  explanation: string;
  fix: string;
  estimates?: Record<string, number | string>;
  detailTags: string[];
  risks?: Risk[];
}
