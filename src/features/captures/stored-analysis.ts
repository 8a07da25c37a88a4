import { z } from 'zod';

const n = z.number().nullable().catch(null);

/**
 * The capture analysis a capture attachment carries (`attachment.analysis`, stored when it was
 * uploaded), read defensively: an older or partial record yields nulls, never a crash.
 */
export const storedAnalysisSchema = z.object({
  points: z.number().catch(0),
  sampleIntervalS: n,
  baseV: n,
  topV: n,
  amplitudeV: n,
  riseTimeS: n,
  fallTimeS: n,
  overshootPct: n,
  undershootPct: n,
  ringingFrequencyHz: n,
  periodS: n,
  frequencyHz: n,
  edgeCount: z.number().catch(0),
  edges: z
    .array(
      z.object({
        kind: z.enum(['rise', 'fall']),
        t10S: z.number(),
        t50S: z.number(),
        t90S: z.number(),
        durationS: z.number(),
        overshootPct: z.number(),
        undershootPct: z.number(),
        ringingFrequencyHz: z.number().nullable(),
      }),
    )
    .catch([]),
  referenceLevels: z.object({ lowV: z.number(), midV: z.number(), highV: z.number() }).nullable().catch(null),
  shape: z.enum(['square', 'pulse', 'step', 'sine', 'dc', 'other']).nullable().catch(null),
  clipped: z.boolean().nullable().catch(null),
  tiltPct: n,
  cornerPct: n,
  settleTimeConstantS: n,
  noiseRmsV: n,
  humFrequencyHz: n,
  channel: z.number().catch(1),
  channels: z.array(z.object({ index: z.number(), name: z.string(), unit: z.string() })).catch([]),
  notes: z.array(z.string()).catch([]),
  metadata: z.record(z.string(), z.unknown()).catch({}),
  spectrum: z
    .object({
      binHz: z.number(),
      nyquistHz: z.number(),
      lines: z.array(z.object({ frequencyHz: z.number(), amplitudeV: z.number() })),
      plot: z.object({ frequenciesHz: z.array(z.number()), amplitudesV: z.array(z.number()) }),
    })
    .nullable()
    .catch(null),
});
export type StoredAnalysis = z.infer<typeof storedAnalysisSchema>;

export const readStoredAnalysis = (raw: unknown): StoredAnalysis => storedAnalysisSchema.parse(raw ?? {});
