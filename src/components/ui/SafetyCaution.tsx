import { SAFETY_CAUTIONS } from '../../../shared/safety/hazard';
import { hazardousLiveCitation } from '../../../shared/safety/iec-61010';
import type { Risk } from '../../../shared/schemas/diagnosis';

export interface SafetyCautionProps {
  /** The engine's risks: hazards in red, cautions in amber. */
  risks: Risk[];
  /** Reasons from the recorded setup itself (mains, a hazardous voltage) when the engine gave none. */
  setupReasons?: string[];
  compact?: boolean;
}

// the caution list may carry the standard's citation itself; cite it once
const CITED_IN_LIST = SAFETY_CAUTIONS.some((c) => c.includes('61010'));

function Cautions() {
  return (
    <>
      <ul className="mt-2 list-disc space-y-1 pl-5">
        {SAFETY_CAUTIONS.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
      {!CITED_IN_LIST && <p className="mt-2 text-xs">{hazardousLiveCitation()}</p>}
    </>
  );
}

/**
 * The safety caution (DESIGN.md, Safety) wherever a risk exists: hazards in red with the usual
 * cautions and the standard's levels; cautions in amber, the same advice a click away.
 */
export function SafetyCaution({ risks, setupReasons = [], compact = false }: SafetyCautionProps) {
  const hazards = risks.filter((r) => r.level === 'hazard');
  const cautions = risks.filter((r) => r.level === 'caution');
  const red = hazards.length > 0 || (risks.length === 0 && setupReasons.length > 0);
  if (!red && cautions.length === 0) return null;
  const size = compact ? 'px-3 py-2 text-xs' : 'px-4 py-3 text-sm';
  return (
    <div className="flex flex-col gap-2" data-testid="safety-caution">
      {red && (
        <section role="alert" aria-label="Safety caution" className={`rounded-md border-2 border-hazard bg-hazard-soft ${size}`}>
          <p className="font-serif font-bold text-hazard">Safety: hazardous voltage or earth path</p>
          <ul className="mt-1 space-y-0.5 font-semibold">
            {(hazards.length > 0 ? hazards.map((r) => r.message) : setupReasons).map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
          <Cautions />
        </section>
      )}
      {cautions.length > 0 && (
        <section role="alert" aria-label="Caution" className={`rounded-md border-l-4 border-caution bg-caution-soft ${size}`}>
          <p className="font-semibold">Caution</p>
          <ul className="mt-0.5 space-y-0.5">
            {cautions.map((r) => (
              <li key={r.id}>{r.message}</li>
            ))}
          </ul>
          {!red && (
            <details className="mt-1.5">
              <summary className="cursor-pointer font-semibold">How to probe it safely</summary>
              <Cautions />
            </details>
          )}
        </section>
      )}
    </div>
  );
}
