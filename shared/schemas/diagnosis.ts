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
] as const;
export const causeSchema = z.enum(CAUSES, { error: `Cause must be one of ${CAUSES.join(', ')}` });
export type Cause = z.infer<typeof causeSchema>;

export const CAUSE_LABELS: Record<Cause, string> = {
  'attenuation-mismatch': 'Attenuation setting mismatch',
  'termination-mismatch': 'High-impedance probe on a 50 Ω input',
  loading: 'Circuit loading by the probe',
  bandwidth: 'Bandwidth too low for the edge',
  compensation: 'Probe compensation out of adjustment',
  'ground-lead': 'Ground-lead ringing',
};

export const GROUND_KINDS = ['clip-lead', 'spring', 'none'] as const;
export type GroundKind = (typeof GROUND_KINDS)[number];
export const SIGNAL_KINDS = ['square', 'sine', 'pulse', 'dc', 'other'] as const;
export type SignalKind = (typeof SIGNAL_KINDS)[number];

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
});

export const scopeInputSchema = z.object({
  /** The attenuation the channel is set to assume. */
  attenuationSetting: attenuation('Channel attenuation setting'),
  inputResistanceOhm: quantity('Scope input resistance', 'Ω', positive(1e12)),
  inputCapacitanceF: quantity('Scope input capacitance', 'F', positive(1e-6)),
  bandwidthHz: quantity('Scope bandwidth', 'Hz', positive(1e12)),
  /** Cut-off of a bandwidth-limit filter switched on at the channel. */
  bandwidthLimitHz: quantity('Bandwidth limit', 'Hz', positive(1e12)),
});

export const circuitInputSchema = z.object({
  sourceResistanceOhm: quantity('Source resistance', 'Ω', { min: 0, minAllowed: true, max: 1e12 }),
});

export const signalInputSchema = z.object({
  expectedAmplitudeV: quantity('Expected amplitude', 'V', positive(1e5)),
  /** Leave out for DC. */
  frequencyHz: quantity('Signal frequency', 'Hz', positive(1e12, 'leave it out for DC')),
  riseTimeS: quantity('Signal rise time', 's', positive(1)),
  kind: z.enum(SIGNAL_KINDS, { error: 'Signal kind must be square, sine, pulse, dc or other' }).nullish(),
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
});
export type Predicted = z.infer<typeof predictedSchema>;

export const hypothesisSchema = z.object({
  cause: causeSchema,
  /** Share of belief among the returned hypotheses; they sum to 1. */
  likelihood: z.number().min(0).max(1),
  predicted: predictedSchema,
  explanation: z.string(),
  fix: z.string(),
  /** Values inferred backwards from the observation (implied ratio, inductance, lead length…). */
  estimates: z.record(z.string(), z.union([z.number(), z.string()])).optional(),
  /** Root-sum-square of the log-ratio residuals against what was observed. */
  residual: z.number().optional(),
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
  hypotheses: z.array(hypothesisSchema),
  tags: z.array(z.string()),
  assumptions: z.array(assumptionSchema),
  risks: z.array(riskSchema).optional(),
});
export type DiagnosisResult = z.infer<typeof diagnosisResultSchema>;
