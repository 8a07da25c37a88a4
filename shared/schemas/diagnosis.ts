import { z } from 'zod';
import { formatEngineering } from '../units/engineering';

/** Causes the engine knows, in the order the UI lists them. */
export const CAUSES = [
  'attenuation-mismatch',
  'termination-mismatch',
  'loading',
  'bandwidth',
  'compensation',
  'ground-lead',
  'aliasing',
  'clipping',
  'ac-coupling',
  'common-mode',
  'mains-pickup',
  'generator-load',
] as const;
export const causeSchema = z.enum(CAUSES, { error: `Cause must be one of ${CAUSES.join(', ')}` });
export type Cause = z.infer<typeof causeSchema>;

/** What a hypothesis may name: a cause, or `faithful` (the recorded setup explains the trace). */
export const HYPOTHESIS_CAUSES = [...CAUSES, 'faithful'] as const;
export const hypothesisCauseSchema = z.enum(HYPOTHESIS_CAUSES);
export type HypothesisCause = z.infer<typeof hypothesisCauseSchema>;

export const CAUSE_LABELS: Record<HypothesisCause, string> = {
  'attenuation-mismatch': 'Attenuation setting mismatch',
  'termination-mismatch': 'High-impedance probe on a 50 Ω input',
  loading: 'Circuit loading by the probe',
  bandwidth: 'Bandwidth too low for the edge',
  compensation: 'Probe compensation out of adjustment',
  'ground-lead': 'Ground-lead ringing',
  aliasing: 'Aliasing: sample rate too low',
  clipping: 'Clipping: trace beyond the screen',
  'ac-coupling': 'AC coupling droop or lost DC level',
  'common-mode': 'Common-mode or reference error',
  'mains-pickup': 'Mains hum or ground loop',
  'generator-load': 'Generator load setting mismatch',
  faithful: 'The trace is true: the setup explains it',
};


/**
 * `measurement-error`: a cause fits; `faithful`: the recorded setup predicts what was seen and
 * no cause moves it beyond its significance; `unexplained`: nothing fits within the fit gate.
 */
export const VERDICTS = ['measurement-error', 'faithful', 'unexplained'] as const;
export const verdictSchema = z.enum(VERDICTS);
export type Verdict = z.infer<typeof verdictSchema>;

export const GROUND_KINDS = ['clip-lead', 'spring', 'none'] as const;
export type GroundKind = (typeof GROUND_KINDS)[number];
export const SIGNAL_KINDS = ['square', 'sine', 'pulse', 'dc', 'other'] as const;
export type SignalKind = (typeof SIGNAL_KINDS)[number];
export const PROBE_KINDS = ['passive', 'active', 'differential', 'current'] as const;
export type ProbeKind = (typeof PROBE_KINDS)[number];
export const COUPLINGS = ['dc', 'ac'] as const;
export type Coupling = (typeof COUPLINGS)[number];
export const GENERATOR_LOADS = ['50-ohm', 'high-z'] as const;
export type GeneratorLoad = (typeof GENERATOR_LOADS)[number];

interface Bounds {
  min: number;
  /** Whether `min` itself is allowed (0 m of ground lead is; 0 F of capacitance is not). */
  minAllowed: boolean;
  max: number;
  hint?: string;
}

/**
 * A finite number in SI units within physical bounds, with messages naming the field.
 * `null` is read as "not given", so a capture analysis with null fields can be passed on.
 */
function quantity(label: string, unit: string, bounds: Bounds) {
  const show = (v: number) =>
    unit === '' ? String(v) : unit === '%' ? `${v} %` : formatEngineering(v, unit);
  const hint = bounds.hint ? ` (${bounds.hint})` : '';
  const base = z.number({ error: `${label} must be a finite number${unit ? ` in ${unit}` : ''}` });
  const lowest = bounds.minAllowed
    ? base.min(bounds.min, `${label} must be at least ${show(bounds.min)}${hint}`)
    : base.gt(bounds.min, `${label} must be greater than ${show(bounds.min)}${hint}`);
  return lowest.max(bounds.max, `${label} must be at most ${show(bounds.max)}`).nullish();
}

const positive = (max: number, hint?: string): Bounds => ({ min: 0, minAllowed: false, max, hint });
const attenuation = (label: string) =>
  quantity(label, '', { min: 1, minAllowed: true, max: 1e7, hint: '1 for 1x, 10 for 10x' });

export const probeInputSchema = z.object({
  /** The probe's actual ratio: 10 for 10x; for a switchable probe, its switch position. */
  attenuation: attenuation('Probe attenuation'),
  /** Total capacitance the circuit sees at the tip with the probe on its scope (data-sheet figure). */
  tipCapacitanceF: quantity('Tip capacitance', 'F', positive(1e-6)),
  groundLeadM: quantity('Ground lead length', 'm', { min: 0, minAllowed: true, max: 10 }),
  bandwidthHz: quantity('Probe bandwidth', 'Hz', positive(1e12)),
  tipResistanceOhm: quantity('Tip resistance', 'Ω', positive(1e12)),
  groundKind: z.enum(GROUND_KINDS, { error: 'Ground must be clip-lead, spring or none' }).nullish(),
  groundWireRadiusM: quantity('Ground wire radius', 'm', positive(0.01)),
  kind: z.enum(PROBE_KINDS, { error: 'Probe kind must be passive, active, differential or current' }).nullish(),
  /** A differential probe's common-mode rejection at the signal frequency, in dB. */
  cmrrDb: quantity('Probe CMRR', 'dB', { min: 0, minAllowed: true, max: 200 }),
});

export const scopeInputSchema = z.object({
  /** The attenuation the channel is set to assume. */
  attenuationSetting: attenuation('Channel attenuation setting'),
  inputResistanceOhm: quantity('Scope input resistance', 'Ω', positive(1e12)),
  inputCapacitanceF: quantity('Scope input capacitance', 'F', positive(1e-6)),
  bandwidthHz: quantity('Scope bandwidth', 'Hz', positive(1e12)),
  /** Cut-off of a bandwidth-limit filter switched on at the channel. */
  bandwidthLimitHz: quantity('Bandwidth limit', 'Hz', positive(1e12)),
  /** The scope's own 10–90 % rise time when its data sheet gives one. */
  riseTimeS: quantity('Scope rise time', 's', positive(1)),
  coupling: z.enum(COUPLINGS, { error: 'Coupling must be dc or ac' }).nullish(),
  /** AC-coupling corner with a low-impedance source (data-sheet figure). */
  acCornerHz: quantity('AC-coupling corner', 'Hz', positive(1e6)),
  sampleRateHz: quantity('Sample rate', 'Sa/s', positive(1e13)),
  voltsPerDiv: quantity('Vertical scale', 'V/div', positive(1e5)),
  /** Input voltage at the screen's centre line. */
  offsetV: quantity('Offset', 'V', { min: -1e5, minAllowed: true, max: 1e5 }),
  divisions: quantity('Vertical divisions', '', { min: 1, minAllowed: true, max: 100 }),
});

export const circuitInputSchema = z.object({
  sourceResistanceOhm: quantity('Source resistance', 'Ω', { min: 0, minAllowed: true, max: 1e12 }),
  /** What the source really drives (a generator's load). */
  loadResistanceOhm: quantity('Load resistance', 'Ω', positive(1e15)),
  /** Peak voltage from earth of the node the probe's ground or reference lead is on. */
  referenceV: quantity('Reference node voltage', 'V', { min: -1e6, minAllowed: true, max: 1e6 }),
  /** Highest voltage present anywhere a probe or lead may touch. */
  highestVoltageV: quantity('Highest voltage present', 'V', { min: -1e6, minAllowed: true, max: 1e6 }),
  mainsConnected: z.boolean({ error: 'Mains connected must be true or false' }).nullish(),
  mainsFrequencyHz: quantity('Mains frequency', 'Hz', { min: 16, minAllowed: true, max: 1000 }),
});

export const signalInputSchema = z.object({
  expectedAmplitudeV: quantity('Expected amplitude', 'V', positive(1e5)),
  /** Leave out for DC. */
  frequencyHz: quantity('Signal frequency', 'Hz', positive(1e12, 'leave it out for DC')),
  riseTimeS: quantity('Signal rise time', 's', positive(1)),
  kind: z.enum(SIGNAL_KINDS, { error: 'Signal kind must be square, sine, pulse, dc or other' }).nullish(),
  /** The signal's low level (default 0; a sine's −A/2). */
  baseV: quantity('Signal low level', 'V', { min: -1e5, minAllowed: true, max: 1e5 }),
  /** The load the generator's amplitude setting assumes. */
  generatorLoad: z.enum(GENERATOR_LOADS, { error: 'Generator load must be 50-ohm or high-z' }).nullish(),
});

export const observedInputSchema = z.object({
  amplitudeV: quantity('Observed amplitude', 'V', positive(1e5)),
  riseTimeS: quantity('Observed rise time', 's', positive(1)),
  overshootPct: quantity('Observed overshoot', '%', {
    min: -100,
    minAllowed: true,
    max: 1000,
    hint: 'negative for undershoot',
  }),
  ringingFrequencyHz: quantity('Observed ringing frequency', 'Hz', positive(1e12)),
  frequencyHz: quantity('Observed frequency', 'Hz', positive(1e12)),
  clipped: z.boolean({ error: 'Observed clipped must be true or false' }).nullish(),
  /** Droop across a flat top as % of the step. */
  tiltPct: quantity('Observed tilt', '%', { min: -100, minAllowed: true, max: 100 }),
  humFrequencyHz: quantity('Observed hum frequency', 'Hz', positive(1e6)),
});

/** Body of `POST /api/diagnosis`: SI units, every object and field optional. Unknown keys are dropped. */
export const diagnosisInputSchema = z.object({
  probe: probeInputSchema.nullish(),
  scope: scopeInputSchema.nullish(),
  circuit: circuitInputSchema.nullish(),
  signal: signalInputSchema.nullish(),
  observed: observedInputSchema.nullish(),
});
export type DiagnosisInput = z.infer<typeof diagnosisInputSchema>;

/** What a hypothesis says the scope shows. */
export const predictedSchema = z.object({
  amplitudeV: z.number().optional(),
  riseTimeS: z.number().optional(),
  overshootPct: z.number().optional(),
  ringingFrequencyHz: z.number().optional(),
  frequencyHz: z.number().optional(),
  tiltPct: z.number().optional(),
  humFrequencyHz: z.number().optional(),
  /** Height of the spike each edge brings through (termination mismatch), on the screen's scale. */
  spikeV: z.number().optional(),
});
export type Predicted = z.infer<typeof predictedSchema>;

export const hypothesisSchema = z.object({
  /** The first of `causes`, or `faithful`. */
  cause: hypothesisCauseSchema,
  /** Every cause of a combined hypothesis; one entry otherwise. */
  causes: z.array(hypothesisCauseSchema).min(1),
  /** Share of belief among the returned hypotheses; they sum to 1. */
  likelihood: z.number().min(0).max(1),
  predicted: predictedSchema,
  explanation: z.string(),
  fix: z.string(),
  /** One bench action that tells this cause from the others. */
  confirm: z.string(),
  /** The residual is under the fit gate. */
  fits: z.boolean(),
  /** Values inferred backwards from the observation (implied ratio, inductance, lead length…). */
  estimates: z.record(z.string(), z.union([z.number(), z.string()])).optional(),
  /** Root-sum-square of the log-ratio residuals against what was observed (0 when nothing was compared). */
  residual: z.number(),
  /**
   * Causes the recorded settings themselves imply (a 10x probe on a 1x channel) that this
   * hypothesis leaves out, on what was observed: for it to hold, a recorded value must be wrong.
   */
  ruledOutBy: z.array(hypothesisCauseSchema).optional(),
});
export type Hypothesis = z.infer<typeof hypothesisSchema>;

/** A value the engine filled in because the case left it out. */
export const assumptionSchema = z.object({
  field: z.string(),
  value: z.union([z.number(), z.string()]),
  unit: z.string(),
  why: z.string(),
});
export type Assumption = z.infer<typeof assumptionSchema>;

export const riskSchema = z.object({
  id: z.string(),
  level: z.enum(['caution', 'hazard']),
  message: z.string(),
});
export type Risk = z.infer<typeof riskSchema>;

export const diagnosisResultSchema = z.object({
  verdict: verdictSchema,
  hypotheses: z.array(hypothesisSchema),
  tags: z.array(z.string()),
  assumptions: z.array(assumptionSchema),
  risks: z.array(riskSchema),
});
export type DiagnosisResult = z.infer<typeof diagnosisResultSchema>;
