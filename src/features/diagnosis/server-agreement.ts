import type { DiagnosisResult, Predicted } from '../../../shared/schemas/diagnosis';

export interface Agreement {
  /** Same causes in the same order, with the same likelihoods and predictions. */
  agrees: boolean;
  /** Largest likelihood difference between the two rankings, 0–1. */
  largestDifference: number;
}

// Both sides run the same shared code; anything beyond float noise means they drifted apart.
const TOLERANCE = 1e-9;

function samePredicted(a: Predicted, b: Predicted): boolean {
  const keys = new Set([...Object.keys(a), ...Object.keys(b)] as (keyof Predicted)[]);
  return [...keys].every((k) => {
    const x = a[k];
    const y = b[k];
    if (x === undefined || y === undefined) return x === y;
    return Math.abs(x - y) <= TOLERANCE * Math.max(1e-30, Math.abs(x), Math.abs(y));
  });
}

/** Compares the browser's instant result with the server's for the same input. */
export function compareResults(local: DiagnosisResult, server: DiagnosisResult): Agreement {
  const n = Math.max(local.hypotheses.length, server.hypotheses.length);
  let largestDifference = 0;
  let agrees = local.hypotheses.length === server.hypotheses.length;
  for (let i = 0; i < n; i++) {
    const a = local.hypotheses[i];
    const b = server.hypotheses[i];
    if (!a || !b) continue;
    largestDifference = Math.max(largestDifference, Math.abs(a.likelihood - b.likelihood));
    if (a.cause !== b.cause || !samePredicted(a.predicted, b.predicted)) agrees = false;
  }
  return { agrees: agrees && largestDifference <= TOLERANCE, largestDifference };
}
