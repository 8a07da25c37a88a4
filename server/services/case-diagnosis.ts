import { diagnosisInputFromSetup } from '../../shared/diagnosis/from-case-setup';
import { diagnose } from '../../shared/diagnosis/ranker';
import type { CaseSetup, StatedCause } from '../../shared/schemas/case';
import { CAUSES, type Cause, type DiagnosisResult } from '../../shared/schemas/diagnosis';
import { logger } from '../logger';

export interface StoredDiagnosis {
  diagnosis: DiagnosisResult | null;
  engineCause: Cause | null;
  /** The stated cause, else the engine's top cause. */
  cause: string | null;
  disagrees: boolean;
  engineTags: string[];
}

/**
 * The engine's top cause, or null when it names none: a faithful or unexplained verdict, a
 * top hypothesis that does not fit, or a tie at the top. A combined hypothesis gives its
 * first cause.
 */
export function clearTopCause(diagnosis: DiagnosisResult | null): Cause | null {
  if (!diagnosis || diagnosis.verdict !== 'measurement-error') return null;
  const [top, second] = diagnosis.hypotheses;
  if (!top || top.likelihood <= 0 || !top.fits || top.cause === 'faithful') return null;
  if (second && second.cause !== top.cause && top.likelihood - second.likelihood < 1e-3) return null;
  return top.cause;
}

/** A stored diagnosis as the columns of its case row. */
export function diagnosisColumns(d: StoredDiagnosis) {
  return { diagnosis: d.diagnosis ? JSON.stringify(d.diagnosis) : null, engine_cause: d.engineCause, cause: d.cause, disagrees: d.disagrees ? 1 : 0 };
}

/** The server's own recomputation on every save, so a stored diagnosis never trusts the client. */
export function recomputeDiagnosis(setup: CaseSetup, statedCause: StatedCause | null | undefined): StoredDiagnosis {
  let diagnosis: DiagnosisResult | null = null;
  try {
    diagnosis = diagnose(diagnosisInputFromSetup(setup));
  } catch (err) {
    // a model bug must not lose the author's save; the case shows no diagnosis instead
    logger.error({ err }, 'diagnosis failed');
  }
  const engineCause = clearTopCause(diagnosis);
  const disagrees = Boolean(statedCause && (CAUSES as readonly string[]).includes(statedCause) && engineCause && engineCause !== statedCause);
  return {
    diagnosis,
    engineCause,
    cause: statedCause ?? engineCause,
    disagrees,
    engineTags: diagnosis?.tags ?? [],
  };
}
