import type { DiagnosisResult } from '../../../shared/schemas/diagnosis';
import { verdictLead, verdictWords } from '../../lib/hypothesis-words';

const TONES = {
  agree: 'border-agree bg-agree-soft',
  caution: 'border-caution bg-caution-soft',
  plain: 'border-ink/60 bg-sheet',
} as const;

export interface VerdictSummaryProps {
  result: DiagnosisResult;
  /** Anything under "what the scope showed" was recorded; without it there is no verdict to give. */
  observedAny: boolean;
  /** Labels of values worth recording next (what the engine had to assume, what was not observed). */
  recordNext?: string[];
  compact?: boolean;
}

/** The engine's answer first, in plain words: the trace is true, it misleads and why, or nothing fits. */
export function VerdictSummary({ result, observedAny, recordNext = [], compact = false }: VerdictSummaryProps) {
  const words = verdictWords(result, observedAny);
  const lead = observedAny ? verdictLead(result) : undefined;
  const unexplained = observedAny && result.verdict === 'unexplained';
  return (
    <section
      aria-label="Verdict"
      data-testid="verdict"
      data-verdict={observedAny ? result.verdict : 'none'}
      className={`rounded-md border-l-4 ${compact ? 'px-3 py-2 text-xs' : 'px-4 py-3 text-sm'} ${TONES[words.tone]}`}
    >
      <p className={`font-serif font-bold ${compact ? 'text-sm' : 'text-base'}`}>{words.title}</p>
      <p className="mt-1">{words.body}</p>
      {lead?.confirm && (
        <p className="mt-1.5">
          <span className="font-semibold">Confirm at the bench: </span>
          {lead.confirm}
        </p>
      )}
      {unexplained && (
        <div className="mt-1.5">
          <p>
            <span className="font-semibold">Record next: </span>
            {recordNext.length > 0 ? `${recordNext.slice(0, 6).join(', ')}${recordNext.length > 6 ? ', …' : ''}.` : 'every value of the setup you can read off the probe, the channel menu and the circuit.'}
          </p>
          <p className="mt-0.5">Then check the reading a second way: a meter on the node, a second probe on the same point, or the capture itself.</p>
        </div>
      )}
    </section>
  );
}
