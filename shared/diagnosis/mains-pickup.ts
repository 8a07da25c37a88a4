import type { Candidate, ModelContext, ResolvedSetup } from './types';
import { eng } from './wording';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  'Clip the probe tip to its own ground at the test point (circuit still powered): hum that stays on the trace is picked up by the leads or a ground loop, not present in the circuit.';

/** The two mains frequencies in use, Hz. source: IEC 60038 (50 Hz and 60 Hz systems). */
export const MAINS_FREQUENCIES_HZ = [50, 60] as const;

/**
 * A hum frequency is a harmonic when within 3 % of it and within a tenth of the harmonic
 * spacing (so high harmonics, packed closely, do not match anything). Our tolerances: grids
 * hold about ±1 %, screens read to a few %.
 */
const HARMONIC_TOLERANCE = { relative: 0.03, ofSpacing: 0.1 } as const;
/** Highest harmonic counted as mains (our bound: rectifier and switching currents reach the tens). */
const HIGHEST_HARMONIC = 40;
// our estimates: a hum line at a mains harmonic is strong evidence, more so on mains-connected equipment
const HIDDEN_HUM_PRIOR = { mainsConnected: 0.5, unsaid: 0.35 } as const;

export interface HarmonicMatch {
  mainsFrequencyHz: number;
  /** Which harmonic (1 for the fundamental). */
  harmonic: number;
  /** n·f_mains, Hz. */
  harmonicHz: number;
  /** |ln(f_hum/(n·f_mains))|. */
  error: number;
}

/**
 * The mains harmonic n·f_mains nearest a hum frequency, n = round(f_hum/f_mains) ≥ 1.
 * source: Fourier series of a periodic mains-locked disturbance: lines at whole multiples
 * of the mains frequency (rectifier charging currents put most at 2f and odd multiples).
 */
export function nearestHarmonic(humHz: number, mainsFrequencyHz: number): HarmonicMatch {
  const harmonic = Math.max(1, Math.round(humHz / mainsFrequencyHz));
  const harmonicHz = harmonic * mainsFrequencyHz;
  return { mainsFrequencyHz, harmonic, harmonicHz, error: Math.abs(Math.log(humHz / harmonicHz)) };
}

/**
 * The best mains harmonic for an observed hum: the recorded mains frequency first; with none
 * recorded, whichever of 50 Hz and 60 Hz fits better. Undefined when none is within tolerance.
 */
export function matchMainsHarmonic(humHz: number, mainsFrequencyHz?: number): HarmonicMatch | undefined {
  const grids = mainsFrequencyHz === undefined ? MAINS_FREQUENCIES_HZ : [mainsFrequencyHz];
  // Compared on the distance in Hz: the nearer line wins, whichever grid it belongs to.
  const best = grids.map((f) => nearestHarmonic(humHz, f)).sort((a, b) => Math.abs(humHz - a.harmonicHz) - Math.abs(humHz - b.harmonicHz))[0];
  const offHz = Math.abs(humHz - best.harmonicHz);
  const close = best.error <= HARMONIC_TOLERANCE.relative && offHz <= HARMONIC_TOLERANCE.ofSpacing * best.mainsFrequencyHz;
  return close && best.harmonic <= HIGHEST_HARMONIC ? best : undefined;
}

const FIX =
  'Break the loop: one ground point, the scope and the circuit on the same outlet strip, short probe grounds, no second ground path through a generator, USB cable or another channel; twist or shield leads to high-impedance nodes. Never lift a protective earth to do it.';

/** Mains-pickup candidates: hum the recorded mains connection predicts, and the harmonic an observed hum line fits. */
export function assessMainsPickup({ setup, observed }: ModelContext): Candidate[] {
  const candidates = [recordedMains(setup)];
  const humHz = observed.humFrequencyHz;
  if (humHz === undefined) return candidates;
  const match = matchMainsHarmonic(humHz, setup.mainsFrequencyHz);
  if (!match) return candidates;
  const ordinal = match.harmonic === 1 ? 'the mains frequency itself' : `harmonic ${match.harmonic} of ${eng(match.mainsFrequencyHz, 'Hz')} mains`;
  const why =
    match.harmonic === 1
      ? 'the mark of a ground loop or of pickup from mains wiring'
      : match.harmonic % 2 === 0 && match.harmonic <= 4
        ? 'the mark of rectifier charging currents flowing in a shared ground'
        : 'the mark of non-linear mains loads (rectifiers, dimmers, switching supplies) coupling in';
  candidates[0].estimates = { ...candidates[0].estimates, humHarmonic: match.harmonic };
  candidates.push({
    cause: 'mains-pickup',
    basis: 'fitted',
    hiddenPrior: setup.mainsConnected ? HIDDEN_HUM_PRIOR.mainsConnected : HIDDEN_HUM_PRIOR.unsaid,
    deviation: Math.log(1.1),
    predicted: { humFrequencyHz: match.harmonicHz },
    explanation: `Hum at ${eng(humHz, 'Hz')} is ${ordinal}${setup.mainsFrequencyHz === undefined ? ' (the mains frequency is not recorded; this fits best)' : ''}: ${why}. It rides on the trace whatever the circuit does.`,
    confirm: CONFIRM,
    fix: FIX,
    estimates: { humHarmonic: match.harmonic, mainsFrequencyHz: match.mainsFrequencyHz },
    detailTags: match.harmonic === 1 ? ['mains-hum', 'ground-loop'] : ['mains-hum', 'mains-harmonic'],
    ...(setup.mainsConnected ? { risks: [earthCaution()] } : {}),
  });
  return candidates;
}

function earthCaution() {
  return {
    id: 'keep-protective-earth',
    level: 'caution' as const,
    message:
      'To break a ground loop on mains-connected equipment, never remove or lift a protective earth: use one ground point, an isolation transformer for the circuit where appropriate, or a differential or isolated probe. Follow local codes and licensed practice.',
  };
}

function recordedMains(setup: ResolvedSetup): Candidate {
  const common = { cause: 'mains-pickup' as const, basis: 'recorded' as const, confirm: CONFIRM, fix: FIX };
  if (!setup.mainsConnected) {
    return {
      ...common,
      deviation: 0,
      predicted: {},
      explanation: 'The case does not record mains-connected equipment, so the setup predicts no hum.',
      fix: 'Nothing to change.',
      detailTags: [],
    };
  }
  const assumed = setup.mainsFrequencyHz === undefined;
  const mainsHz = setup.mainsFrequencyHz ?? MAINS_FREQUENCIES_HZ[0];
  const earthLoop = setup.groundKind !== 'none';
  return {
    ...common,
    // The hum's size depends on loop area and currents the case does not record: a small, nominal error.
    deviation: Math.log(1.05),
    predicted: { humFrequencyHz: mainsHz },
    explanation:
      `The equipment is on the mains${assumed ? ' (frequency not recorded: 50 Hz taken)' : ` at ${eng(mainsHz, 'Hz')}`}: ` +
      (earthLoop
        ? "the probe's ground and the equipment's protective earth close a loop through the building wiring, and any current in it shows as hum at the mains frequency and its harmonics."
        : 'with no probe ground at the test point, the return takes the long way through protective earth and picks up hum at the mains frequency and its harmonics.'),
    estimates: assumed ? { assumedMainsFrequencyHz: mainsHz } : { mainsFrequencyHz: mainsHz },
    detailTags: [],
    risks: [earthCaution()],
  };
}
