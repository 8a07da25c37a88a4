import { useDeferredValue, useMemo } from 'react';
import { useWatch } from 'react-hook-form';
import { diagnosisInputFromSetup } from '../../../../shared/diagnosis/from-case-setup';
import { diagnose } from '../../../../shared/diagnosis/ranker';
import { CAUSE_LABELS, type Cause, type DiagnosisResult } from '../../../../shared/schemas/diagnosis';
import type { CaseFormApi } from '../form/case-form-schema';
import { readableSetup } from '../form/case-form-values';
import { DiagnosisView } from './DiagnosisView';

/** The engine run in the browser on whatever the form says right now (the server reruns it on save). */
export function LiveDiagnosisPanel({ form }: { form: CaseFormApi }) {
  const values = useWatch({ control: form.control });
  const deferred = useDeferredValue(values);
  const statedCause = form.getValues('statedCause');
  const { result, setup, failed } = useMemo(() => {
    const s = readableSetup(form.getValues());
    try {
      return { result: diagnose(diagnosisInputFromSetup(s)) as DiagnosisResult, setup: s, failed: false };
    } catch {
      return { result: null, setup: s, failed: true };
    }
    // `deferred` only says when to recompute (typing stays smooth); getValues gives the full typed values
  }, [deferred, form]);
  const top = result?.hypotheses[0];
  const observedAny = Object.values(setup.observed ?? {}).some((v) => typeof v === 'number');
  const disagrees = Boolean(top && statedCause && statedCause !== 'other' && statedCause !== top.cause);
  return (
    <section aria-labelledby="live-diagnosis-title" className="rounded-lg border border-rule bg-sheet p-4">
      <h2 id="live-diagnosis-title" className="text-lg">
        Live diagnosis
      </h2>
      <p className="mt-0.5 mb-3 text-xs text-muted">Recomputed from the setup as you type. Record what you observed to rank the causes.</p>
      {failed && <p className="text-sm text-caution">The engine could not read this setup; check the values in the form.</p>}
      {result && !observedAny && (
        <p className="mb-2 rounded-md border border-dashed border-rule px-3 py-2 text-xs text-muted">
          Nothing observed yet, so the causes are ranked by how much each would distort this setup.
        </p>
      )}
      {result && <DiagnosisView result={result} observed={setup.observed} limit={3} />}
      {disagrees && top && (
        <p className="mt-3 rounded-md border-l-4 border-caution bg-caution-soft px-3 py-2 text-xs">
          Your stated cause ({CAUSE_LABELS[statedCause as Cause]}) is not the engine's first choice ({CAUSE_LABELS[top.cause]}). A reviewer will look twice; say why in the
          narrative.
        </p>
      )}
    </section>
  );
}
