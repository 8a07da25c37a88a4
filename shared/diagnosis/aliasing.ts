import type { Candidate, ModelContext, ResolvedSetup } from './types';
import { eng, factor } from './wording';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  'Change the timebase (or the sample rate) by a small step: an alias jumps to another frequency, a true signal stays where it is.';

/**
 * Frequency a sampled sine appears at: |f − k·f_s| with k the nearest whole number to f/f_s,
 * so the result lies between 0 and f_s/2 (f itself when f ≤ f_s/2). In Hz.
 * source: sampling theorem (Nyquist–Shannon); spectrum of a sampled signal repeats every f_s.
 *
 * @param signalHz frequency at the probe tip, Hz
 * @param sampleRateHz samples per second, Sa/s
 */
export function aliasFrequencyHz(signalHz: number, sampleRateHz: number): number {
  const k = Math.round(signalHz / sampleRateHz);
  return Math.abs(signalHz - k * sampleRateHz);
}

/** Half the sample rate, the highest frequency a sampled record can show, f_s/2, in Hz. */
export const nyquistFrequencyHz = (sampleRateHz: number): number => sampleRateHz / 2;

/**
 * Inverse: every sample rate below 2·f that shows a signal of f at f_obs, from
 * f_obs = |f − k·f_s| ⇒ f_s = (f ∓ f_obs)/k, keeping those whose nearest k is k (so f_obs ≤ f_s/2).
 * Highest first: the mildest undersampling that explains the trace. In Sa/s.
 *
 * @param signalHz frequency at the probe tip, Hz
 * @param shownHz frequency the screen shows, Hz
 * @param maxK how many multiples of f_s to try
 */
export function impliedSampleRatesHz(signalHz: number, shownHz: number, maxK = 50): number[] {
  const rates: number[] = [];
  for (let k = 1; k <= maxK; k++) {
    for (const rate of [(signalHz + shownHz) / k, (signalHz - shownHz) / k]) {
      if (rate <= 0 || rate >= 2 * signalHz) continue;
      if (Math.abs(aliasFrequencyHz(signalHz, rate) - shownHz) <= 1e-9 * signalHz) rates.push(rate);
    }
  }
  return [...new Set(rates)].sort((a, b) => b - a);
}

/** A shown frequency within this share of the true one is the true one (our threshold: screen readings). */
const SAME_FREQUENCY = 0.03;
/** A sample rate below this (Sa/s) is implausible for a digital scope (our bound). */
const LOWEST_PLAUSIBLE_RATE_HZ = 1;
// our estimates: how often an unrecorded (or misremembered) sample rate is the culprit
const HIDDEN_RATE_PRIOR = { unrecorded: 0.35, recorded: 0.1 } as const;

const periodic = (setup: ResolvedSetup) => setup.frequencyHz !== undefined && setup.frequencyHz > 0 && setup.signalKind !== 'dc';

/** Aliasing candidates: the recorded sample rate, and the sample rate an observed frequency implies. */
export function assessAliasing({ setup, observed }: ModelContext): Candidate[] {
  const candidates: Candidate[] = [recordedRate(setup)];
  const signalHz = setup.frequencyHz;
  const shownHz = observed.frequencyHz;
  if (!periodic(setup) || signalHz === undefined || shownHz === undefined) return candidates;
  if (Math.abs(Math.log(shownHz / signalHz)) <= SAME_FREQUENCY || shownHz >= signalHz) return candidates;
  const rates = impliedSampleRatesHz(signalHz, shownHz).filter((r) => r >= LOWEST_PLAUSIBLE_RATE_HZ);
  if (rates.length === 0) return candidates;
  const rateHz = rates[0];
  const recorded = setup.sampleRateHz;
  const estimates = { impliedSampleRateHz: rateHz, nyquistFrequencyHz: nyquistFrequencyHz(rateHz), aliasOrder: Math.round(signalHz / rateHz) };
  const others = rates.slice(1, 3).map((r) => eng(r, 'Sa/s'));
  candidates.push({
    cause: 'aliasing',
    basis: 'fitted',
    hiddenPrior: recorded === undefined ? HIDDEN_RATE_PRIOR.unrecorded : HIDDEN_RATE_PRIOR.recorded,
    deviation: Math.abs(Math.log(shownHz / signalHz)),
    predicted: { frequencyHz: aliasFrequencyHz(signalHz, rateHz) },
    explanation:
      `A ${eng(signalHz, 'Hz')} signal shown at ${eng(shownHz, 'Hz')} fits sampling at about ${eng(rateHz, 'Sa/s')}: above half the sample rate (${eng(rateHz / 2, 'Hz')}) the samples trace the difference ${eng(signalHz, 'Hz')} − ${factor(Math.round(signalHz / rateHz))} × ${eng(rateHz, 'Sa/s')}` +
      `${others.length ? ` (${others.join(' or ')} would do the same)` : ''}.` +
      (recorded === undefined ? '' : ` The case records ${eng(recorded, 'Sa/s')}.`),
    confirm: CONFIRM,
    fix: FIX,
    estimates,
    ...(recorded === undefined || Math.abs(Math.log(recorded / rateHz)) < 0.05
      ? {}
      : { contradictions: [{ field: 'scope.sampleRateHz', recorded, implied: rateHz }] }),
    detailTags: ['undersampled'],
  });
  return candidates;
}

const FIX =
  'Sample at least 2.5 times the highest frequency present (5–10 times a clock’s fundamental to keep its edges): a shorter timebase or a longer record raises the rate; peak-detect mode shows what lies between samples.';

function recordedRate(setup: ResolvedSetup): Candidate {
  const common = { cause: 'aliasing' as const, basis: 'recorded' as const, confirm: CONFIRM };
  const rateHz = setup.sampleRateHz;
  const signalHz = setup.frequencyHz;
  if (rateHz === undefined || signalHz === undefined || !periodic(setup)) {
    return {
      ...common,
      deviation: 0,
      predicted: {},
      explanation:
        rateHz === undefined
          ? 'No sample rate is recorded, so aliasing cannot be predicted from the setup.'
          : 'The signal has no recorded frequency, so there is nothing to alias.',
      fix: rateHz === undefined ? 'Note the sample rate the scope showed (it falls with slower timebases).' : 'Nothing to change.',
      detailTags: [],
    };
  }
  const shownHz = aliasFrequencyHz(signalHz, rateHz);
  const nyquistHz = nyquistFrequencyHz(rateHz);
  const estimates = { nyquistFrequencyHz: nyquistHz, aliasFrequencyHz: shownHz };
  if (signalHz <= nyquistHz) {
    const harmonics = setup.signalKind === 'square' && 3 * signalHz > nyquistHz;
    return {
      ...common,
      deviation: 0,
      predicted: { frequencyHz: signalHz },
      explanation:
        `At ${eng(rateHz, 'Sa/s')} everything up to ${eng(nyquistHz, 'Hz')} is sampled faithfully, and the ${eng(signalHz, 'Hz')} signal is below that.` +
        (harmonics ? ' Its harmonics are not: edges will look uneven from cycle to cycle, though the frequency reads right.' : ''),
      fix: harmonics ? FIX : 'Nothing to change.',
      estimates,
      detailTags: [],
    };
  }
  // A signal aliased to (almost) DC shows as a slow wander or a flat line: count it as 1000× off.
  const deviation = shownHz > signalHz * 1e-3 ? Math.log(signalHz / shownHz) : Math.log(1000);
  return {
    ...common,
    deviation,
    predicted: { frequencyHz: shownHz },
    explanation: `At ${eng(rateHz, 'Sa/s')} only frequencies up to ${eng(nyquistHz, 'Hz')} are shown faithfully; the ${eng(signalHz, 'Hz')} signal folds down to $\\lvert f - k f_s \\rvert$ = ${eng(shownHz, 'Hz')} (k = ${Math.round(signalHz / rateHz)}), so the trace ${shownHz > signalHz * 1e-3 ? `looks ${factor(signalHz / shownHz)} times slower than it is` : 'shows a flat line or a slow wander'}.`,
    fix: FIX,
    estimates,
    detailTags: ['undersampled'],
  };
}
