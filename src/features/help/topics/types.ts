import type { Cause } from '../../../../shared/schemas/diagnosis';

export interface Formula {
  /** TeX, typeset by KaTeX, e.g. `t_r \approx \frac{0.35}{\text{BW}}`; written to stay readable as source. */
  tex: string;
  /** What it says, in a few words. */
  meaning: string;
}

export interface Source {
  label: string;
  /** Where in it, or why it is "common practice". */
  note?: string;
}

/** One Help page: a cause the engine knows, or a page of its own (safety, the engine). */
export interface HelpTopic {
  slug: string;
  title: string;
  cause?: Cause;
  /** One line for the index. */
  lead: string;
  /** What it looks like on the screen (markdown). */
  onScreen: string;
  /** Why it happens, in our words (markdown). */
  physics: string;
  formulas: Formula[];
  /** A worked example with numbers (markdown). */
  example?: string;
  /** Fields for `/diagnose?…`, by their API path, SI numbers. */
  diagnose?: Record<string, string | number>;
  /** What to do about it (markdown). */
  fix: string;
  sources: Source[];
}

/** The Diagnose screen pre-filled with a topic's example. */
export const diagnoseHref = (fields: Record<string, string | number>) =>
  `/diagnose?${new URLSearchParams(Object.entries(fields).map(([k, v]) => [k, String(v)])).toString()}`;
