import type { CasePatchInput, CaseSetup, StatedCause } from '../../../shared/schemas/case';

/** Someone at the invented company; `handle` is the local part of their e-mail (used for @mentions). */
export interface DemoPerson {
  handle: string;
  email: string;
  name: string;
  role: 'engineer' | 'moderator' | 'admin';
  /** What they do at the company, for the story only. */
  job: string;
  joinedAt: string;
}

/**
 * The waveform behind a case's capture and screenshot, in the units the scope showed.
 * Each shape is computed by the engine's own model of the cause (shared/diagnosis).
 */
export type DemoWave =
  /** A square wave or a single edge through a single pole with this time constant (0 = ideal). */
  | { shape: 'edge'; levelV: number; baseV?: number; periodS?: number; timeConstantS: number; spanS: number; noiseV: number }
  /** The edge of a mis-adjusted divider probe: jumps, then settles with the divider's τ. */
  | { shape: 'compensation'; levelV: number; periodS: number; overshootPct: number; spanS: number; noiseV: number }
  /** A step into the series R–L–C of ground lead and tip capacitance. */
  | { shape: 'ground-lead'; levelV: number; sourceResistanceOhm: number; inductanceH: number; capacitanceF: number; edgeS: number; spanS: number; noiseV: number }
  /** A sine, e.g. after a loading divider. */
  | { shape: 'sine'; amplitudeV: number; frequencyHz: number; offsetV?: number; spanS: number; noiseV: number }
  /** A flat level with noise (a DC rail). */
  | { shape: 'dc'; levelV: number; spanS: number; noiseV: number; humV?: number; humHz?: number };

/** One thing that happens to a case after it is written, at a fixed time. */
export type DemoStep =
  | { at: string; do: 'comment'; by: string; body: string }
  | { at: string; do: 'submit' }
  | { at: string; do: 'revise'; patch: CasePatchInput; by?: string }
  | { at: string; do: 'send_back'; by: string; note: string }
  | { at: string; do: 'verify'; by: string; note?: string }
  | { at: string; do: 'retire'; by: string; note: string }
  | { at: string; do: 'duplicate'; by: string; of: string; note?: string }
  | { at: string; do: 'pin'; by: string };

export interface DemoCase {
  /** Stable handle, for duplicates and tests. */
  key: string;
  author: string;
  createdAt: string;
  title: string;
  summary: string;
  narrative: string;
  setup: CaseSetup;
  statedCause?: StatedCause;
  statedCauseOther?: string;
  fix?: string;
  lessonSummary?: string;
  lessonDetail?: string;
  tags?: string[];
  /** Generated files attached while the case is a draft. */
  wave?: DemoWave;
  attach?: ('capture' | 'screenshot')[];
  steps: DemoStep[];
}
