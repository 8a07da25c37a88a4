import { diagnose } from '../diagnosis/ranker';
import type { DiagnosisInput, HypothesisCause } from '../schemas/diagnosis';
import { formatEngineering } from '../units/engineering';
import { readFacts, SYMPTOM_KINDS, type Fact } from './symptom-phrases';

/** The numbers a symptom query states, for ranking cases whose own numbers are near them. */
export interface SymptomNumbers {
  /** Shown ÷ expected amplitude. */
  amplitudeRatio?: number;
  ringingFrequencyHz?: number;
  overshootPct?: number;
  riseTimeS?: number;
  tiltPct?: number;
  humFrequencyHz?: number;
}

export interface SymptomReading {
  /** What was read, in words: "amplitude ×0.1", "ringing at 120 MHz". */
  observations: string[];
  /** Causes the engine says fit, most likely first. */
  causes: { cause: HypothesisCause; likelihood: number }[];
  /** Only the numbers the query itself stated (stand-ins for unstated ones are left out). */
  numbers: SymptomNumbers;
  /** "read as: amplitude ×0.1 → attenuation mismatch" */
  text: string;
  /** The engine input the reading was made from. */
  input: DiagnosisInput;
}

/** Short cause names for the reading line. */
export const CAUSE_SHORT: Record<HypothesisCause, string> = {
  'attenuation-mismatch': 'attenuation mismatch',
  'termination-mismatch': 'termination mismatch',
  loading: 'loading',
  bandwidth: 'bandwidth',
  compensation: 'compensation',
  'ground-lead': 'ground-lead ringing',
  aliasing: 'aliasing',
  clipping: 'clipping',
  'ac-coupling': 'AC coupling',
  'common-mode': 'common mode',
  'mains-pickup': 'mains hum',
  'generator-load': 'generator load setting',
  faithful: 'the trace is true',
};

// Stand-ins for a symptom named without a number: typical of the trade, our choices.
const UNSTATED = {
  ringingHz: 120e6, // about what a 15 cm clip lead and 12 pF give
  sourceEdgeS: 2e-9,
  slowEdgeS: 20e-9,
  rollOffHz: 10e6,
  rollOffRatio: 0.5,
  sagRatio: 0.9,
  aliasSignalHz: 1e6, // a clock, the usual thing to alias
  aliasShownRatio: 1 / 500, // "a few kHz where the clock is MHz"
  droopSquareHz: 100, // AC-coupling droop shows on slow squares
  tiltPct: 10,
  humHz: 50, // the mains frequency of most of the world
} as const;

/** Below this a cause is not named in the reading (the engine's own tag threshold). */
const NAME_THRESHOLD = 0.2;

const first = <K extends Fact['kind']>(facts: Fact[], kind: K) => facts.find((f) => f.kind === kind) as Extract<Fact, { kind: K }> | undefined;
const ratioText = (r: number) => `×${Number(r.toPrecision(2))}`;
const pctText = (p: number) => `${p > 0 ? '+' : '−'}${Number(Math.abs(p).toPrecision(3))} %`;

/** The engine input for a set of facts, and the words for what was observed. */
function inputOf(facts: Fact[]): { input: DiagnosisInput; observations: string[]; numbers: SymptomNumbers } {
  const probe: NonNullable<DiagnosisInput['probe']> = {};
  const scope: NonNullable<DiagnosisInput['scope']> = {};
  const signal: NonNullable<DiagnosisInput['signal']> = {};
  const observed: NonNullable<DiagnosisInput['observed']> = {};
  const observations: string[] = [];
  const numbers: SymptomNumbers = {};

  const frequency = first(facts, 'frequency');
  if (frequency) signal.frequencyHz = frequency.hz;
  if (first(facts, 'square')) signal.kind = 'square';
  const p = first(facts, 'probe');
  if (p) probe.attenuation = p.ratio;
  const s = first(facts, 'setting');
  if (s) scope.attenuationSetting = s.ratio;
  const input = first(facts, 'input');
  if (input) scope.inputResistanceOhm = input.ohm;
  const lead = first(facts, 'ground-lead');
  if (lead) probe.groundLeadM = lead.m;
  const limit = first(facts, 'bandwidth-limit');
  if (limit) scope.bandwidthLimitHz = limit.hz;
  const acCoupling = first(facts, 'ac-coupling');
  if (acCoupling) scope.coupling = 'ac';

  const amplitude = first(facts, 'amplitude');
  if (first(facts, 'roll-off')) {
    signal.kind = 'sine';
    signal.frequencyHz ??= UNSTATED.rollOffHz;
    const ratio = amplitude?.ratio ?? UNSTATED.rollOffRatio;
    signal.expectedAmplitudeV = 1;
    observed.amplitudeV = ratio;
    if (amplitude) numbers.amplitudeRatio = ratio;
    observations.push(amplitude ? `amplitude ${ratioText(ratio)} at ${formatEngineering(signal.frequencyHz, 'Hz')}` : 'amplitude falling with frequency');
  } else if (first(facts, 'dc-sag')) {
    signal.kind = 'dc';
    delete signal.frequencyHz;
    const ratio = amplitude?.ratio ?? UNSTATED.sagRatio;
    signal.expectedAmplitudeV = 1;
    observed.amplitudeV = ratio;
    if (amplitude) numbers.amplitudeRatio = ratio;
    observations.push(amplitude ? `DC level ${ratioText(ratio)}` : 'DC level sagging');
  } else if (amplitude) {
    signal.expectedAmplitudeV = 1;
    observed.amplitudeV = amplitude.ratio;
    if (amplitude.stated === false) observations.push('amplitude off by a round factor');
    else {
      numbers.amplitudeRatio = amplitude.ratio;
      observations.push(`amplitude ${ratioText(amplitude.ratio)}`);
    }
  }

  const ringing = first(facts, 'ringing');
  if (ringing) {
    observed.ringingFrequencyHz = ringing.hz ?? UNSTATED.ringingHz;
    if (ringing.hz) numbers.ringingFrequencyHz = ringing.hz;
    observations.push(ringing.hz ? `ringing at ${formatEngineering(ringing.hz, 'Hz')}` : 'ringing');
  }
  const overshoot = first(facts, 'overshoot');
  if (overshoot) {
    observed.overshootPct = overshoot.pct;
    if (overshoot.stated) numbers.overshootPct = overshoot.pct;
    const word = overshoot.pct > 0 ? 'overshoot' : 'undershoot';
    observations.push(overshoot.stated ? `${word} ${pctText(overshoot.pct)}` : overshoot.pct > 0 ? 'spikes on corners' : 'rounded corners');
  }
  const slow = first(facts, 'slow-edges');
  if (slow) {
    signal.kind ??= 'square';
    if (slow.riseS === undefined) signal.riseTimeS = UNSTATED.sourceEdgeS;
    observed.riseTimeS = slow.riseS ?? UNSTATED.slowEdgeS;
    if (slow.riseS) numbers.riseTimeS = slow.riseS;
    observations.push(slow.riseS ? `rise time ${formatEngineering(slow.riseS, 's')}` : 'rounded edges');
  }

  const alias = first(facts, 'alias');
  if (alias) {
    signal.kind ??= 'square';
    const signalHz = alias.signalHz ?? signal.frequencyHz ?? UNSTATED.aliasSignalHz;
    signal.frequencyHz = signalHz;
    observed.frequencyHz = alias.shownHz ?? signalHz * UNSTATED.aliasShownRatio;
    observations.push(alias.shownHz ? `${formatEngineering(alias.shownHz, 'Hz')} shown for ${formatEngineering(signalHz, 'Hz')}` : 'looks slower than it is');
  }
  if (first(facts, 'clipped')) {
    observed.clipped = true;
    observations.push('tops cut flat (clipped)');
  }
  const tilt = first(facts, 'tilt');
  if (tilt) {
    signal.kind = 'square';
    signal.frequencyHz ??= UNSTATED.droopSquareHz;
    observed.tiltPct = tilt.pct ?? UNSTATED.tiltPct;
    if (tilt.pct !== undefined) numbers.tiltPct = tilt.pct;
    observations.push(tilt.pct === undefined ? 'tops droop' : `tops droop ${Number(tilt.pct.toPrecision(3))} %`);
  }
  const hum = first(facts, 'hum');
  if (hum) {
    observed.humFrequencyHz = hum.hz ?? UNSTATED.humHz;
    if (hum.hz !== undefined) numbers.humFrequencyHz = hum.hz;
    observations.push(hum.hz === undefined ? 'hum' : `hum at ${formatEngineering(hum.hz, 'Hz')}`);
  }

  if (p && s && p.ratio !== s.ratio) observations.push(`${p.ratio}x probe read as ${s.ratio}x`);
  else if (p && !s && !amplitude) observations.push(`${p.ratio}x probe`);
  if (input) observations.push(`${input.ohm} Ω input`);
  if (lead) observations.push(`${formatEngineering(lead.m, 'm')} ground lead`);
  if (limit) observations.push(`${formatEngineering(limit.hz, 'Hz')} bandwidth limit`);
  if (acCoupling) observations.push('AC coupling');

  return { input: { probe, scope, signal, observed }, observations, numbers };
}

/** A setup fact that by itself predicts a wrong trace (a ratio mismatch, a 50 Ω input, a long lead). */
const suspectSetup = (facts: Fact[]) => {
  const p = first(facts, 'probe');
  const s = first(facts, 'setting');
  return Boolean((p && s && p.ratio !== s.ratio) || first(facts, 'input') || first(facts, 'ground-lead') || first(facts, 'bandwidth-limit') || first(facts, 'ac-coupling'));
};

/**
 * Reads a symptom query into observations, asks the diagnosis engine which causes fit them,
 * and words the result: "read as: amplitude ×0.1 → attenuation mismatch".
 * Null when the query states no symptom and no suspect setup (then it is only text).
 */
export function readSymptomQuery(query: string): SymptomReading | null {
  const facts = readFacts(query);
  if (!facts.some((f) => SYMPTOM_KINDS.has(f.kind)) && !suspectSetup(facts)) return null;
  const { input, observations, numbers } = inputOf(facts);
  let hypotheses;
  try {
    hypotheses = diagnose(input).hypotheses;
  } catch {
    return null;
  }
  const named = hypotheses.filter((h, i) => i === 0 || h.likelihood >= NAME_THRESHOLD).slice(0, 2);
  const causes = named.map((h) => ({ cause: h.cause, likelihood: h.likelihood }));
  const text = `read as: ${observations.join(', ')} → ${causes.map((c) => CAUSE_SHORT[c.cause]).join(' or ')}`;
  return { observations, causes, numbers, text, input };
}
