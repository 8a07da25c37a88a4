import { useMutation } from '@tanstack/react-query';
import type { DiagnosisInput, DiagnosisResult } from '../../../../shared/schemas/diagnosis';
import { api } from '../../../lib/api-client';

export const diagnosisKeys = {
  all: ['diagnosis'] as const,
  run: () => [...diagnosisKeys.all, 'run'] as const,
};

/** POST /api/diagnosis: the server runs the same shared engine on the setup (SI units). */
export function runDiagnosis(input: DiagnosisInput): Promise<DiagnosisResult> {
  return api<DiagnosisResult>('/api/diagnosis', { method: 'POST', body: input });
}

/** A mutation, not a query: it computes rather than reads, and nothing it returns is cached for others. */
export function useRunDiagnosis() {
  return useMutation({ mutationKey: diagnosisKeys.run(), mutationFn: runDiagnosis });
}
