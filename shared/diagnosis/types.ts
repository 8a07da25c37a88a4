import type { Cause, Coupling, GeneratorLoad, GroundKind, Predicted, ProbeKind, Risk, SignalKind } from '../schemas/diagnosis';

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
  probeKind: ProbeKind;
  /** A differential probe's common-mode rejection at the signal frequency, dB. */
  probeCmrrDb?: number;
  /** The scope's own 10–90 % rise time from its data sheet, when recorded. */
  scopeRiseTimeS?: number;
  coupling: Coupling;
  /** The coupling was recorded (else DC is taken, the usual setting). */
  couplingRecorded: boolean;
  /** AC-coupling corner with a low-impedance source, Hz. */
  acCornerHz?: number;
  sampleRateHz?: number;
  voltsPerDiv?: number;
  /** Input voltage at the screen's centre line. */
  offsetV?: number;
  /** Vertical divisions on screen (8 unless recorded). */
  divisions: number;
  /** What the source really drives (a generator's load), Ω. */
  loadResistanceOhm?: number;
  /** Peak voltage from earth of the node the probe's ground or reference lead is on. */
  referenceV?: number;
  highestVoltageV?: number;
  mainsConnected?: boolean;
  mainsFrequencyHz?: number;
  /** The signal's low level, V (0 unless recorded). */
  baseV?: number;
  /** The load the generator's amplitude setting assumes. */
  generatorLoad?: GeneratorLoad;
  /** Names of fields the engine filled in, e.g. "probe.groundLeadM". */
  assumed: ReadonlySet<string>;
}

/** What was read off the screen, with null and absent both meaning "not observed". */
export interface Observed {
  amplitudeV?: number;
  riseTimeS?: number;
  overshootPct?: number;
  ringingFrequencyHz?: number;
  frequencyHz?: number;
  clipped?: boolean;
  /** Droop across a flat top, % of the step. */
  tiltPct?: number;
  humFrequencyHz?: number;
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
  /**
   * How well this model knows the amplitude it predicts (log units, one standard deviation),
   * when that is looser than a screen reading: the height of needles depends on the edge's
   * shape and the channel's bandwidth, which a lumped model only approximates.
   */
  amplitudeSigma?: number;
  /**
   * How far this recorded prediction may be off because a recorded value it rests on is an
   * estimate (log units, one standard deviation, the reading's own spread included): widens
   * the test of what the record asserts against other hypotheses, not this one's own fit.
   */
  recordSpread?: { amplitudeSigma: number; riseTimeSigma: number };
  /** One bench action that tells this cause from the others. */
  confirm: string;
  /**
   * Recorded values this candidate's fit contradicts (a 90 cm lead implied where 1 cm was
   * recorded); the ranker penalises each by how far it is off.
   */
  contradictions?: Contradiction[];
  /**
   * The predicted overshoot is an upper bound (ground-lead ringing: the probe's lossy cable
   * damps more than the source resistance alone), so less overshoot seen costs little.
   */
  overshootUpperBound?: boolean;
  /**
   * Other causes this one fault also acts as (a probe switched to 1x is an attenuation
   * mismatch, a bandwidth stage and a load at once): listed after `cause` in the hypothesis's
   * `causes` and tagged with it.
   */
  alsoCauses?: Cause[];
  /**
   * The recorded setup makes the screen no measurement of the circuit as it runs (a
   * single-ended probe's ground clip on a node away from earth shorts that node): no number to
   * fit, but the cause stands, and every hypothesis without it is ruled out by the record.
   */
  notAMeasurement?: boolean;
  estimates?: Record<string, number | string>;
  detailTags: string[];
  risks?: Risk[];
}

/**
 * A recorded value a fitted candidate disagrees with. `toleranceLn` is how far apart the two
 * may be, in natural-log units, before the disagreement counts as one standard deviation;
 * `evidence.ts` holds the tolerance of each field when a model gives none.
 */
export interface Contradiction {
  field: string;
  recorded: number;
  implied: number;
  toleranceLn?: number;
}
