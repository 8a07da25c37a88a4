import type { Candidate, Contradiction, ModelContext, ResolvedSetup } from './types';
import { clampPlausible, PLAUSIBLE } from './plausibility';
import { TYPICAL } from './defaults';
import { chainMagnitudeAt } from './bandwidth';
import { eng, percent } from './wording';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  'Swap the clip lead for the ground spring at the same point: ringing that moves up in frequency or vanishes came from the lead.';

/** Vacuum magnetic permeability, H/m. source: CODATA 2018 recommended values. */
export const MU0_H_PER_M = 1.25663706212e-6;

/**
 * Self-inductance of a straight round wire, L = (μ0·l/2π)·(ln(2l/r) − 3/4), in H.
 * The low-frequency form (current spread evenly over the cross-section, internal inductance
 * included); at high frequency, with the current on the surface, −3/4 becomes −1. Valid for
 * l ≫ r; returns 0 where the formula would go negative.
 * source: E. B. Rosa, Bull. Bureau of Standards 4 (1908); F. W. Grover, Inductance
 * Calculations (1946), straight round wire: L = 0.002·l·(ln(2l/ρ) − 3/4) µH with l, ρ in cm.
 *
 * @param lengthM wire length, m
 * @param radiusM wire radius, m
 */
export function straightWireInductanceH(lengthM: number, radiusM: number): number {
  if (lengthM <= 0 || radiusM <= 0) return 0;
  const l = ((MU0_H_PER_M * lengthM) / (2 * Math.PI)) * (Math.log((2 * lengthM) / radiusM) - 0.75);
  return Math.max(0, l);
}

/**
 * Inverse of `straightWireInductanceH`: the length of wire with a given inductance, by
 * bisection (L rises monotonically with l once l > r). Undefined outside 1.1·r … 100 m.
 */
export function leadLengthForInductanceM(inductanceH: number, radiusM: number): number | undefined {
  let low = 1.1 * radiusM;
  let high = 100;
  if (!(inductanceH > straightWireInductanceH(low, radiusM)) || inductanceH > straightWireInductanceH(high, radiusM)) {
    return undefined;
  }
  for (let i = 0; i < 200 && high - low > 1e-12 * high; i++) {
    const mid = (low + high) / 2;
    if (straightWireInductanceH(mid, radiusM) < inductanceH) low = mid;
    else high = mid;
  }
  return (low + high) / 2;
}

/** Series R–L–C: source resistance, lead inductance, tip capacitance. */
export interface GroundLeadParams {
  sourceResistanceOhm: number;
  inductanceH: number;
  capacitanceF: number;
}

export interface Resonance {
  /** 1/(2π√(LC)), Hz. */
  naturalFrequencyHz: number;
  /** ζ = (R/2)·√(C/L). */
  dampingRatio: number;
  /** f_n·√(1 − ζ²) when ζ < 1, Hz. */
  ringingFrequencyHz?: number;
  /** Step overshoot exp(−πζ/√(1 − ζ²)) in percent; 0 when ζ ≥ 1. */
  overshootPct: number;
}

/**
 * Resonance of the series RLC the ground lead forms with the tip capacitance.
 * source: standard second-order step response (e.g. Ogata, Modern Control Engineering,
 * ch. 5: ω_n = 1/√(LC), ζ = (R/2)√(C/L), M_p = exp(−πζ/√(1−ζ²)), ω_d = ω_n√(1−ζ²)).
 */
export function groundLeadResonance(p: GroundLeadParams): Resonance {
  const naturalFrequencyHz = 1 / (2 * Math.PI * Math.sqrt(p.inductanceH * p.capacitanceF));
  const dampingRatio = (p.sourceResistanceOhm / 2) * Math.sqrt(p.capacitanceF / p.inductanceH);
  if (dampingRatio >= 1) return { naturalFrequencyHz, dampingRatio, overshootPct: 0 };
  return {
    naturalFrequencyHz,
    dampingRatio,
    ringingFrequencyHz: naturalFrequencyHz * Math.sqrt(1 - dampingRatio ** 2),
    overshootPct: secondOrderOvershootPct(dampingRatio),
  };
}

/** Peak overshoot of an underdamped second-order step, 100·exp(−πζ/√(1−ζ²)); 0 for ζ ≥ 1. */
export function secondOrderOvershootPct(dampingRatio: number): number {
  if (dampingRatio >= 1) return 0;
  return 100 * Math.exp((-Math.PI * dampingRatio) / Math.sqrt(1 - dampingRatio ** 2));
}

/** Voltage across C for a unit step into the series RLC, at each time (s); 0 before t = 0. */
export function groundLeadStepResponse(p: GroundLeadParams, timesS: readonly number[]): number[] {
  const wn = 1 / Math.sqrt(p.inductanceH * p.capacitanceF);
  const zeta = (p.sourceResistanceOhm / 2) * Math.sqrt(p.capacitanceF / p.inductanceH);
  return timesS.map((t) => {
    if (t < 0) return 0;
    if (zeta < 1) {
      const wd = wn * Math.sqrt(1 - zeta ** 2);
      const decay = Math.exp(-zeta * wn * t);
      return 1 - decay * (Math.cos(wd * t) + (zeta / Math.sqrt(1 - zeta ** 2)) * Math.sin(wd * t));
    }
    if (zeta === 1) return 1 - Math.exp(-wn * t) * (1 + wn * t);
    const root = Math.sqrt(zeta ** 2 - 1);
    const s1 = -wn * (zeta - root);
    const s2 = -wn * (zeta + root);
    return 1 + (s2 * Math.exp(s1 * t) - s1 * Math.exp(s2 * t)) / (s1 - s2);
  });
}

/** Inductance that rings at f with C when undamped, L = 1/((2πf)²C), in H. */
export function inductanceForRingingH(ringingFrequencyHz: number, capacitanceF: number): number {
  return 1 / ((2 * Math.PI * ringingFrequencyHz) ** 2 * capacitanceF);
}

/**
 * Inductance whose damped ringing f_d = f_n√(1−ζ²) matches an observation, with R and C
 * known: the larger root of 4ω²L² − 4L/C + R² = 0. Falls back to the undamped formula when
 * R is too large for any underdamped fit.
 */
export function inductanceForDampedRingingH(p: Omit<GroundLeadParams, 'inductanceH'>, ringingFrequencyHz: number): number {
  const w = 2 * Math.PI * ringingFrequencyHz;
  const inverseC = 1 / p.capacitanceF;
  const discriminant = inverseC ** 2 - (w * p.sourceResistanceOhm) ** 2;
  if (discriminant < 0) return inductanceForRingingH(ringingFrequencyHz, p.capacitanceF);
  return (inverseC + Math.sqrt(discriminant)) / (2 * w * w);
}

/**
 * Share of an ideal step's ringing left after a linear-ramp edge of 10–90 % time t_r
 * (ramp length T = t_r/0.8): the ramp averages the ringing over T, a sin(x)/x factor with
 * x = π·f·T; its envelope (1/x beyond π/2) is used so the estimate does not hinge on
 * exact nulls.
 */
export function edgeRingingFactor(ringingFrequencyHz: number, edgeRiseTimeS: number | undefined): number {
  if (!edgeRiseTimeS) return 1;
  const x = (Math.PI * ringingFrequencyHz * edgeRiseTimeS) / 0.8;
  if (x < 1e-9) return 1;
  return x <= Math.PI / 2 ? Math.sin(x) / x : 1 / x;
}

const LONG_LEAD_M = 0.05; // our threshold for the 'long-ground-lead' tag
/** Ringing that overshoots less than this is lost in the trace (our threshold). */
const VISIBLE_OVERSHOOT_PCT = 1;
// our estimates: an assumed lead length is a guess, so a length fitted to the ringing beats it
const HIDDEN_LEAD_PRIOR = { unrecorded: 0.6, recorded: 0.25 };
/** A recorded spring still varies with how it sits: its 1 cm is held to about a factor of 2. */
const SPRING_TOLERANCE_LN = Math.log(2);

/** Ground-lead candidates: the recorded lead, and the lead an observed ringing implies. */
export function assessGroundLead({ setup, observed }: ModelContext): Candidate[] {
  const recorded = recordedLead(setup);
  const candidates: Candidate[] = [recorded];
  const ring = observed.ringingFrequencyHz;
  if (ring === undefined) return candidates;
  const base = { sourceResistanceOhm: setup.sourceResistanceOhm, capacitanceF: setup.tipCapacitanceF };
  const r = setup.groundWireRadiusM;
  const rawH = inductanceForDampedRingingH(base, ring);
  const rawLengthM = leadLengthForInductanceM(rawH, r);
  // Bounded to a lead someone could have used: a clamped lead predicts its own ringing, which then fails to fit.
  const fromH = rawLengthM ?? (rawH > straightWireInductanceH(PLAUSIBLE.leadLengthM.max, r) ? Infinity : 0);
  const { value: lengthM, clamped } = clampPlausible('leadLengthM', fromH);
  const inductanceH = clamped ? straightWireInductanceH(lengthM, r) : rawH;
  const unrecordedLength = setup.groundLeadM === undefined || setup.assumed.has('probe.groundLeadM');
  const springRecorded = setup.groundKind === 'spring' && !setup.assumed.has('probe.groundKind');
  const shown = shownOvershoot(setup, { ...base, inductanceH });
  const impliedLengthM = clamped ? fromH : lengthM;
  const inverse: Record<string, number> = { impliedInductanceH: rawH, ...(Number.isFinite(impliedLengthM) && impliedLengthM > 0 ? { impliedLeadLengthM: impliedLengthM } : {}) };
  recorded.estimates = { ...recorded.estimates, ...inverse };
  const contradictions: Contradiction[] = [];
  if (!unrecordedLength && setup.groundLeadM !== undefined) {
    contradictions.push({ field: 'probe.groundLeadM', recorded: setup.groundLeadM, implied: lengthM });
  } else if (springRecorded) {
    contradictions.push({ field: 'probe.groundLeadM', recorded: TYPICAL.springLeadM, implied: lengthM, toleranceLn: SPRING_TOLERANCE_LN });
  }
  const recordedNote = contradictions.length ? ` The case records ${springRecorded && unrecordedLength ? 'a ground spring' : eng(setup.groundLeadM ?? 0, 'm')}, which contradicts this.` : '';
  const implied = clamped
    ? ` No plausible lead reaches that: it needs ${Number.isFinite(fromH) && fromH > 0 ? `about ${eng(fromH, 'm')} of wire` : `${eng(rawH, 'H')}`}, so the fit is held at ${eng(lengthM, 'm')}, which rings near ${eng(shown.ringHz ?? groundLeadResonance({ ...base, inductanceH }).naturalFrequencyHz, 'Hz')}; the ringing comes from something else.`
    : `, which a straight ${eng(2 * r, 'm')} wire reaches at about ${eng(lengthM, 'm')}.`;
  candidates.push({
    cause: 'ground-lead',
    basis: 'fitted',
    hiddenPrior: unrecordedLength && !springRecorded ? HIDDEN_LEAD_PRIOR.unrecorded : HIDDEN_LEAD_PRIOR.recorded,
    deviation: Math.log(1 + (shown.pct ?? 0) / 100),
    predicted: { ringingFrequencyHz: shown.ringHz ?? groundLeadResonance({ ...base, inductanceH }).naturalFrequencyHz, overshootPct: shown.pct },
    overshootUpperBound: true,
    explanation: `Ringing at ${eng(ring, 'Hz')} with the ${eng(setup.tipCapacitanceF, 'F')} tip capacitance implies about ${eng(rawH, 'H')} in the ground loop${clamped ? '.' : ''}${implied}${recordedNote}`,
    confirm: CONFIRM,
    fix:
      setup.groundKind === 'none'
        ? 'Ground the probe at the test point with a ground spring or the shortest lead available, so the return current does not take a long loop.'
        : 'Replace the clip lead with a ground spring on the tip barrel or a probe socket at the test point, and keep the loop between tip and ground as small as possible.',
    estimates: { ...inverse, fittedInductanceH: inductanceH },
    contradictions,
    detailTags: !clamped && lengthM >= LONG_LEAD_M ? ['long-ground-lead'] : [],
  });
  return candidates;
}

/** Overshoot the scope shows: ideal-step overshoot × edge factor × chain magnitude at f_d. */
function shownOvershoot(setup: ResolvedSetup, p: GroundLeadParams): { pct?: number; ringHz?: number; resonance: Resonance } {
  const resonance = groundLeadResonance(p);
  if (!setup.hasEdges) return { resonance };
  const f = resonance.ringingFrequencyHz;
  if (f === undefined) return { pct: 0, resonance };
  const pct = resonance.overshootPct * edgeRingingFactor(f, setup.signalRiseTimeS) * chainMagnitudeAt(setup, f);
  return { pct, ringHz: f, resonance };
}

function recordedLead(setup: ResolvedSetup): Candidate {
  const lead = setup.groundLeadM;
  const common = { cause: 'ground-lead' as const, basis: 'recorded' as const };
  const inductanceH = lead === undefined ? 0 : straightWireInductanceH(lead, setup.groundWireRadiusM);
  if (lead === undefined || inductanceH === 0) {
    return {
      ...common,
      deviation: 0,
      predicted: {},
      explanation:
        lead === undefined
          ? 'No ground is connected at the probe, so the return current finds its own way (through protective earth or another channel): a large, unknown loop that picks up noise and rings.'
          : 'The ground return is too short to model as a wire, so no lead resonance is predicted.',
      confirm: CONFIRM,
      fix: lead === undefined ? 'Ground the probe at the test point with a spring or the shortest lead available.' : 'Nothing to change.',
      detailTags: lead === undefined ? ['no-probe-ground'] : [],
    };
  }
  const p = { sourceResistanceOhm: setup.sourceResistanceOhm, inductanceH, capacitanceF: setup.tipCapacitanceF };
  const { pct, ringHz, resonance } = shownOvershoot(setup, p);
  const springH = straightWireInductanceH(0.01, setup.groundWireRadiusM);
  const spring = springH > 0 ? groundLeadResonance({ ...p, inductanceH: springH }) : undefined;
  let text = `A ${eng(lead, 'm')} ground lead has about ${eng(inductanceH, 'H')}; with the ${eng(setup.tipCapacitanceF, 'F')} tip capacitance it resonates at ${eng(resonance.naturalFrequencyHz, 'Hz')}, and the ${eng(setup.sourceResistanceOhm, 'Ω')} source damps it to ζ = ${resonance.dampingRatio.toFixed(2)}.`;
  if (resonance.ringingFrequencyHz === undefined) text += ' That is overdamped: no ringing.';
  else if (!setup.hasEdges) text += ` A fast edge would ring at ${eng(resonance.ringingFrequencyHz, 'Hz')}; this signal has none.`;
  else {
    text += ` An ideal edge would overshoot ${percent(resonance.overshootPct)} and ring at ${eng(resonance.ringingFrequencyHz, 'Hz')}`;
    text += setup.signalRiseTimeS === undefined ? ' (the edge is taken as ideal)' : '';
    text += `; on screen about ${percent(pct ?? 0)}.`;
  }
  const visible = pct !== undefined && pct >= VISIBLE_OVERSHOOT_PCT;
  return {
    ...common,
    deviation: Math.log(1 + (pct ?? 0) / 100),
    predicted: { overshootPct: pct, ringingFrequencyHz: visible ? ringHz : undefined },
    overshootUpperBound: true,
    explanation: text,
    confirm: CONFIRM,
    fix:
      'Use the shortest ground: a ground spring on the tip barrel or a probe socket at the test point.' +
      (spring && lead > 0.01
        ? ` A 1 cm return moves the resonance to about ${eng(spring.naturalFrequencyHz, 'Hz')} and damps it to ζ = ${spring.dampingRatio.toFixed(2)}.`
        : ''),
    estimates: {
      inductanceH,
      naturalFrequencyHz: resonance.naturalFrequencyHz,
      dampingRatio: resonance.dampingRatio,
      ...(resonance.ringingFrequencyHz === undefined ? {} : { ringingFrequencyHz: resonance.ringingFrequencyHz }),
    },
    detailTags: lead >= LONG_LEAD_M ? ['long-ground-lead'] : [],
  };
}
