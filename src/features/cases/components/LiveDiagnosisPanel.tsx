import { CAUSE_LABELS, type Cause } from '../../../../shared/schemas/diagnosis';
import type { CaseFormApi } from '../form/case-form-schema';
import type { LiveDiagnosis } from '../hooks/use-live-diagnosis';
import { DiagnosisView, observedAnything } from './DiagnosisView';

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
      {result && result.risks.length > 0 && (
        <ul className="mb-3 flex flex-col gap-1 text-xs" aria-label="Risks">
          {result.risks.map((r) => (
            <li key={r.id} className={`rounded-md border-l-4 px-3 py-1.5 ${r.level === 'hazard' ? 'border-hazard bg-hazard-soft' : 'border-caution bg-caution-soft'}`}>
              <span className={`font-semibold ${r.level === 'hazard' ? 'text-hazard' : ''}`}>{r.level === 'hazard' ? 'Hazard: ' : 'Caution: '}</span>
              {r.message}
            </li>
          ))}
          <li className="text-muted">The safety caution above the form says how to probe it; record how you did in the Safety note.</li>
        </ul>
      )}
      {result && <DiagnosisView result={result} observed={setup.observed} limit={3} />}
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
