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
  /** The case's Safety note; when left out, the narrative's **Safety:** paragraph is used. */
  safetyNote?: string;
  tags?: string[];
  /**
   * Files attached while the case is a draft: `captures/<key>.csv` (from the case's ngspice
   * netlist, see spice/README.md) and a screenshot drawn from it.
   */
  attach?: ('capture' | 'screenshot')[];
  steps: DemoStep[];
}
