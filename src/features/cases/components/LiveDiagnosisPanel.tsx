import { CAUSE_LABELS, type Cause, type Risk } from '../../../../shared/schemas/diagnosis';
import type { CaseFormApi } from '../form/case-form-schema';
import type { LiveDiagnosis } from '../hooks/use-live-diagnosis';
import { DiagnosisView, observedAnything } from './DiagnosisView';

/** The engine's risks in brief: hazards always in sight, cautions one click away; the full caution sits above the form. */
function RiskList({ risks }: { risks: Risk[] }) {
  if (risks.length === 0) return null;
  const hazards = risks.filter((r) => r.level === 'hazard');
  const cautions = risks.filter((r) => r.level === 'caution');
  return (
    <div className="flex flex-col gap-1 text-xs" aria-label="Risks" role="group">
      {hazards.map((r) => (
        <p key={r.id} className="rounded-md border-l-4 border-hazard bg-hazard-soft px-3 py-1.5">
          <span className="font-semibold text-hazard">Hazard: </span>
          {r.message}
        </p>
      ))}
      {cautions.length > 0 && (
        <details className="rounded-md border-l-4 border-caution bg-caution-soft px-3 py-1.5">
          <summary className="cursor-pointer font-semibold">
            {cautions.length === 1 ? '1 caution' : `${cautions.length} cautions`}
          </summary>
          <ul className="mt-1 flex flex-col gap-1">
            {cautions.map((r) => (
              <li key={r.id}>{r.message}</li>
            ))}
          </ul>
        </details>
      )}
      <p className="text-muted">The safety caution above the form says how to probe it; record how you did in the Safety note.</p>
    </div>
  );
}

/** The live diagnosis beside the form: the verdict first, then the hypotheses, the risks and what the engine assumed. */
export function LiveDiagnosisPanel({ form, live }: { form: CaseFormApi; live: LiveDiagnosis }) {
  const { result, setup, failed } = live;
  const statedCause = form.getValues('statedCause');
  const judged = observedAnything(setup.observed);
  const backing = result?.hypotheses.filter((h) => h.fits && h.cause !== 'faithful') ?? [];
  const stated = statedCause && statedCause !== 'other' ? (statedCause as Cause) : null;
  const disagrees = Boolean(result && judged && stated && !backing.some((h) => h.causes.includes(stated)));
  return (
    <section aria-labelledby="live-diagnosis-title" className="rounded-lg border border-rule bg-sheet p-4">
      <h2 id="live-diagnosis-title" className="text-lg">
        Live diagnosis
      </h2>
      <p className="mt-0.5 mb-3 text-xs text-muted">Recomputed from the setup as you type. Record what you observed to get a verdict.</p>
      {failed && <p className="text-sm text-caution">The engine could not read this setup; check the values in the form.</p>}
      {result && <DiagnosisView result={result} observed={setup.observed} limit={3} afterVerdict={<RiskList risks={result.risks} />} />}
      {disagrees && stated && (
        <p className="mt-3 rounded-md border-l-4 border-caution bg-caution-soft px-3 py-2 text-xs">
          {result?.verdict === 'faithful'
            ? `The engine finds the trace true, so your stated cause (${CAUSE_LABELS[stated]}) is not what it sees.`
            : `Your stated cause (${CAUSE_LABELS[stated]}) does not fit what you observed.`}{' '}
          A reviewer will look twice; say why in the narrative.
        </p>
      )}
    </section>
  );
}
