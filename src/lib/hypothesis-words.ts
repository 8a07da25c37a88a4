import { CAUSE_LABELS, type DiagnosisResult, type Hypothesis, type Predicted } from '../../shared/schemas/diagnosis';
import type { QuantityUnit } from './quantity';

/** A hypothesis by name: a combined one names both causes ("Attenuation setting mismatch + Ground-lead ringing"). */
export function hypothesisName(h: Pick<Hypothesis, 'cause' | 'causes'>): string {
  const causes = h.causes?.length ? h.causes : [h.cause];
  return causes.map((c) => CAUSE_LABELS[c]).join(' + ');
}

/** The residual as a plain figure: log-ratio units, two decimals. */
export const residualText = (residual: number) => (Number.isFinite(residual) ? residual.toFixed(2) : '—');

export interface PredictedRow {
  key: keyof Predicted;
  label: string;
  unit: QuantityUnit;
  /** Nothing observed is recorded for it (an edge spike): the row shows the prediction only. */
  predictedOnly?: boolean;
}

/** The quantities a hypothesis predicts, in the order the tables list them. */
export const PREDICTED_ROWS: PredictedRow[] = [
  { key: 'amplitudeV', label: 'Amplitude', unit: 'V' },
  { key: 'spikeV', label: 'Edge spike', unit: 'V', predictedOnly: true },
  { key: 'riseTimeS', label: 'Rise time', unit: 's' },
  { key: 'overshootPct', label: 'Overshoot', unit: '%' },
  { key: 'ringingFrequencyHz', label: 'Ringing', unit: 'Hz' },
  { key: 'frequencyHz', label: 'Frequency', unit: 'Hz' },
  { key: 'tiltPct', label: 'Tilt of the tops', unit: '%' },
  { key: 'humFrequencyHz', label: 'Hum', unit: 'Hz' },
];

/**
 * Within 15 % (3 points for a percentage) reads as agreeing: a bench reading's usual slack
 * (common practice, no source). The engine's own fit is the `fits` flag; this only colours a row.
 */
export function readingAgrees(unit: QuantityUnit, predicted: number, observed: number): boolean {
  if (unit === '%') return Math.abs(predicted - observed) <= 3;
  return observed !== 0 && Math.abs(predicted / observed - 1) <= 0.15;
}

/**
 * How close the true trace must be to what was seen (log-ratio units, all readings together) for
 * "the record rules it out" to be the whole story: 20 %, a rise time's slack (our choice).
 */
const SEEN_AS_TRUE_RESIDUAL = 0.2;

export interface VerdictWords {
  tone: 'agree' | 'caution' | 'plain';
  title: string;
  body: string;
}

/** The verdict in our own plain words; `observedAny` false means there is nothing to judge yet. */
export function verdictWords(result: DiagnosisResult, observedAny: boolean): VerdictWords {
  const top = result.hypotheses[0];
  if (!observedAny) {
    return {
      tone: 'plain',
      title: 'No verdict yet: nothing observed is recorded',
      body: 'The causes below are ranked by how far each would move the trace for this setup. Record what the scope showed to test them.',
    };
  }
  if (result.verdict === 'faithful') {
    return {
      tone: 'agree',
      title: 'The trace is true',
      body: 'The recorded setup explains what the scope showed, and no measurement error moves it further than the readings can tell. Debug the circuit, not the probe.',
    };
  }
  if (result.verdict === 'unexplained' || !top) {
    // the true trace fails on the record, not on what was seen: the engine's words say which recorded setting rules it out
    const faithful = result.hypotheses.find((h) => h.cause === 'faithful');
    if (faithful?.ruledOutBy?.length && faithful.residual <= SEEN_AS_TRUE_RESIDUAL) {
      return { tone: 'plain', title: 'The record rules out what was seen', body: faithful.explanation };
    }
    return {
      tone: 'plain',
      title: 'Nothing we model fits this trace',
      body: 'No measurement error the engine knows, alone or two together, reproduces what was observed. Either a value was recorded wrongly or the cause lies outside its models.',
    };
  }
  const fitting = fittingErrors(result);
  const lead = fitting[0] ?? top;
  const more = fitting.length > 1 ? ` ${fitting.length - 1} other hypothesis${fitting.length > 2 ? 'es' : ''} also fit${fitting.length > 2 ? '' : 's'}; the confirming test tells them apart.` : '';
  return {
    tone: 'caution',
    title: `The trace misleads: ${hypothesisName(lead)}`,
    body: `The setup as recorded would not show this; ${lead.causes.length > 1 ? 'these two errors together' : 'this error'} would.${more}`,
  };
}

/** Hypotheses naming a measurement error that fit the observation, most likely first. */
export function fittingErrors(result: DiagnosisResult): Hypothesis[] {
  return result.hypotheses.filter((h) => h.fits && h.cause !== 'faithful');
}

/** The hypothesis the verdict stands on: the faithful one, the first fitting error, or none. */
export function verdictLead(result: DiagnosisResult): Hypothesis | undefined {
  if (result.verdict === 'faithful') return result.hypotheses.find((h) => h.cause === 'faithful') ?? result.hypotheses[0];
  if (result.verdict === 'unexplained') return undefined;
  return fittingErrors(result)[0] ?? result.hypotheses[0];
}
