import type { Risk } from '../schemas/diagnosis';
import { hazardousLive } from '../safety/hazard';
import type { Candidate, ModelContext, ResolvedSetup } from './types';
import { eng, percent } from './wording';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  "Clip both of the differential probe's inputs to the reference node together: whatever the screen still shows is common mode coming through, not signal.";

/**
 * Share of a common-mode voltage a differential probe passes, 10^(−CMRR/20).
 * source: definition of common-mode rejection ratio, CMRR = 20·log10(A_diff/A_cm) in dB.
 */
export function commonModeShare(cmrrDb: number): number {
  return 10 ** (-cmrrDb / 20);
}

/** Inverse: the rejection that lets `leakV` through from `commonModeV`, 20·log10(V_cm/V_leak), dB. */
export function cmrrForLeakDb(commonModeV: number, leakV: number): number {
  return 20 * Math.log10(Math.abs(commonModeV) / leakV);
}

/**
 * Voltage a differential probe lets through from its inputs' common swing, V_cm·10^(−CMRR/20),
 * referred to the probe tip (the screen's scale when the probe's ratio is set right).
 */
export function commonModeLeakV(commonModeV: number, cmrrDb: number): number {
  return Math.abs(commonModeV) * commonModeShare(cmrrDb);
}

/**
 * A typical differential probe's rejection against frequency when the case records none:
 * 60 dB up to 100 kHz, falling 20 dB per decade above, not below 20 dB.
 * from memory: high-voltage differential probe data sheets give about 60–80 dB at mains
 * frequencies and 30–40 dB at tens of MHz; a cautious, simplified curve.
 */
export function typicalCmrrDb(frequencyHz: number | undefined): number {
  if (frequencyHz === undefined || frequencyHz <= 1e5) return 60;
  return Math.max(20, 60 - 20 * Math.log10(frequencyHz / 1e5));
}

/** A reference away from earth by less than this is "at earth" (our threshold, V). */
export const AT_EARTH_V = 0.5;
// our estimate: how often an unrecorded (or optimistic) CMRR explains extra amplitude
const HIDDEN_CMRR_PRIOR = { unrecorded: 0.3, recorded: 0.1 } as const;
/** Plausible differential-probe rejection (our bounds, dB). */
const PLAUSIBLE_CMRR_DB = { low: 0, high: 120 } as const;

const singleEnded = (setup: ResolvedSetup) => setup.probeKind === 'passive' || setup.probeKind === 'active';

/**
 * Common-mode candidates: a differential probe's leak from the reference swing (recorded or
 * fitted to extra amplitude), and, for a single-ended probe grounded away from earth, a hazard.
 */
export function assessCommonMode({ setup, observed }: ModelContext): Candidate[] {
  if (singleEnded(setup)) return [groundedAwayFromEarth(setup)];
  if (setup.probeKind !== 'differential') {
    return [notApplicable('A current probe has no voltage reference lead, so there is no common mode to reject.')];
  }
  const referenceV = setup.referenceV;
  if (referenceV === undefined || Math.abs(referenceV) < AT_EARTH_V) {
    return [notApplicable('The reference node is at earth (or not recorded), so the differential probe sees no common-mode swing to leak.')];
  }
  const assumedCmrr = setup.probeCmrrDb === undefined;
  const cmrrDb = setup.probeCmrrDb ?? typicalCmrrDb(setup.frequencyHz);
  const candidates = [leakCandidate(setup, referenceV, cmrrDb, 'recorded', assumedCmrr)];
  const expected = setup.expectedAmplitudeV;
  const seen = observed.amplitudeV;
  if (expected !== undefined && seen !== undefined && seen > expected * 1.03) {
    const impliedDb = cmrrForLeakDb(referenceV, seen - expected);
    if (impliedDb >= PLAUSIBLE_CMRR_DB.low && impliedDb <= PLAUSIBLE_CMRR_DB.high) {
      const fitted = leakCandidate(setup, referenceV, impliedDb, 'fitted', false);
      fitted.hiddenPrior = assumedCmrr ? HIDDEN_CMRR_PRIOR.unrecorded : HIDDEN_CMRR_PRIOR.recorded;
      fitted.explanation = `The extra ${eng(seen - expected, 'V')} on top of ${eng(expected, 'V')} fits a rejection of ${impliedDb.toFixed(0)} dB against the ${eng(Math.abs(referenceV), 'V')} the reference node swings. ${fitted.explanation}`;
      fitted.estimates = { ...fitted.estimates, impliedCmrrDb: impliedDb };
      if (!assumedCmrr && Math.abs(impliedDb - cmrrDb) > 6) {
        fitted.contradictions = [{ field: 'probe.cmrrDb', recorded: cmrrDb, implied: impliedDb }];
      }
      candidates.push(fitted);
    }
  }
  return candidates;
}

function notApplicable(explanation: string): Candidate {
  return { cause: 'common-mode', basis: 'recorded', deviation: 0, predicted: {}, explanation, confirm: CONFIRM, fix: 'Nothing to change.', detailTags: [] };
}

function leakCandidate(setup: ResolvedSetup, referenceV: number, cmrrDb: number, basis: Candidate['basis'], assumedCmrr: boolean): Candidate {
  const leakV = commonModeLeakV(referenceV, cmrrDb);
  const expected = setup.expectedAmplitudeV;
  const at = setup.frequencyHz === undefined ? '' : ` at ${eng(setup.frequencyHz, 'Hz')}`;
  return {
    cause: 'common-mode',
    basis,
    deviation: expected === undefined ? Math.log(1 + leakV) : Math.log(1 + leakV / expected),
    // In step with the signal (a switching node swinging under its own gate drive) the leak adds to it: the upper bound.
    predicted: expected === undefined ? {} : { amplitudeV: expected + leakV },
    explanation:
      `The reference node swings ${eng(Math.abs(referenceV), 'V')} from earth; a rejection of ${cmrrDb.toFixed(0)} dB${at}` +
      `${assumedCmrr ? ' (not recorded: a typical differential probe’s figure)' : ''} passes 10^(−CMRR/20) = ${percent(100 * commonModeShare(cmrrDb))} of it, ` +
      `about ${eng(leakV, 'V')} on the trace${expected === undefined ? '' : ` beside the ${eng(expected, 'V')} signal (added in full when it moves in step with the signal)`}.`,
    confirm: CONFIRM,
    fix: 'Use a differential probe whose rejection at this frequency keeps the leak small, with short, matched, twisted input leads; or measure from a node nearer earth, or on an isolated channel.',
    estimates: { commonModeLeakV: leakV, cmrrDb, commonModeShare: commonModeShare(cmrrDb) },
    detailTags: leakV >= 0.02 * (expected ?? 1) ? ['common-mode-leak'] : [],
  };
}

/**
 * A single-ended probe's ground is protective earth through the scope: on a node away from
 * earth it is a short, never a measurement. Returned as a risk, with no prediction to fit; the
 * ranker takes it as the record ruling out any true trace (`notAMeasurement`).
 */
function groundedAwayFromEarth(setup: ResolvedSetup): Candidate {
  const referenceV = setup.referenceV;
  const grounded = setup.groundKind !== 'none';
  if (referenceV === undefined || Math.abs(referenceV) < AT_EARTH_V || !grounded) {
    const risks: Risk[] =
      setup.mainsConnected && referenceV === undefined
        ? [
            {
              id: 'reference-not-recorded',
              level: 'caution',
              message:
                "The equipment is on the mains and the reference node's voltage from earth is not recorded: a passive probe's ground clip is tied to protective earth through the scope, so clip it only to a node known to be at earth, or use a differential or isolated probe. Never float the scope. Follow local codes and licensed practice.",
            },
          ]
        : [];
    return { ...notApplicable('The probe is single-ended and its ground sits at earth (or the reference is not recorded), so there is no common mode to reject.'), risks };
  }
  const { hazardous, reasons } = hazardousLive({ highestVoltageV: referenceV, kind: 'peak' });
  return {
    cause: 'common-mode',
    basis: 'recorded',
    deviation: 0,
    predicted: {},
    explanation: `The probe's ground lead is on a node ${eng(Math.abs(referenceV), 'V')} from earth, but a single-ended probe's ground is protective earth through the scope: clipping it there shorts that node to earth. What the screen shows is not a measurement of the circuit as it runs.`,
    confirm: 'Do not repeat it to check: measure the node with a differential probe, or an isolated channel, referenced to the point you need.',
    fix: 'Use a differential probe (or an isolated input) rated for the voltage; never float the scope by lifting its protective earth.',
    estimates: { referenceV },
    notAMeasurement: true,
    detailTags: ['ground-clip-short', 'floating-reference'],
    risks: [
      {
        id: 'ground-clip-off-earth',
        level: 'hazard',
        message:
          `A single-ended probe's ground clip on a node ${eng(Math.abs(referenceV), 'V')} from earth shorts that node to protective earth through the scope: fault currents can destroy the probe, the scope or the circuit.` +
          (hazardous ? ` ${reasons.join(' ')}` : '') +
          ' Use a differential or isolated probe rated for the voltage and its measurement category, never float the scope, and follow local codes and licensed practice.',
      },
    ],
  };
}
