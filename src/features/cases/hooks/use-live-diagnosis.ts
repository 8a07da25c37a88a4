import { useDeferredValue, useMemo } from 'react';
import { useWatch } from 'react-hook-form';
import { diagnosisInputFromSetup } from '../../../../shared/diagnosis/from-case-setup';
import { diagnose } from '../../../../shared/diagnosis/ranker';
import type { CaseSetup } from '../../../../shared/schemas/case';
import type { DiagnosisResult } from '../../../../shared/schemas/diagnosis';
import type { CaseFormApi } from '../form/case-form-schema';
import { readableSetup } from '../form/case-form-values';

export interface LiveDiagnosis {
  result: DiagnosisResult | null;
  setup: CaseSetup;
  /** The engine threw on this setup (a model bug); the form still saves. */
  failed: boolean;
}

/** The engine run in the browser on whatever the form says right now (the server reruns it on save). */
export function useLiveDiagnosis(form: CaseFormApi): LiveDiagnosis {
  const values = useWatch({ control: form.control });
  const deferred = useDeferredValue(values);
  return useMemo(() => {
    const setup = readableSetup(form.getValues());
    try {
      return { result: diagnose(diagnosisInputFromSetup(setup)), setup, failed: false };
    } catch {
      return { result: null, setup, failed: true };
    }
    // `deferred` only says when to recompute (typing stays smooth); getValues gives the full typed values
  }, [deferred, form]);
}
