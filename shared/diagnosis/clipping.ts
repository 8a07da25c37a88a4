import type { Candidate, ModelContext, ResolvedSetup } from './types';
import { eng, factor, percent } from './wording';

/** The bench action that tells this cause from the others. */
const CONFIRM =
  'Turn the vertical scale up a step or two (or centre the offset) until the whole trace fits with a division to spare: a clipped trace grows, a truly flat top stays flat.';

/** Estimate key a candidate sets to say whether its trace runs off the screen ('clipped' or 'fits'). */
export const SCREEN_ESTIMATE = 'screenWindow';

/** The voltage range the screen shows, on the screen's scale (what the channel displays), V. */
export interface ScreenWindow {
  bottomV: number;
  topV: number;
}

/**
 * The screen spans offset ± (divisions/2)·(V/div). Offset and V/div are on the screen's
 * scale: they already include the channel's attenuation setting, as the scope displays them.
 * source: definition of vertical scale and offset on a graticule; common practice.
 *
 * @param voltsPerDiv vertical scale, V per division
 * @param offsetV voltage at the screen's centre line, V
 * @param divisions vertical divisions on the graticule (8 on most screens)
 */
export function screenWindow(voltsPerDiv: number, offsetV: number, divisions: number): ScreenWindow {
  const halfV = (divisions / 2) * voltsPerDiv;
  return { bottomV: offsetV - halfV, topV: offsetV + halfV };
}

/** The part of a span [lowV, highV] left inside the window: what a clipped trace still shows. */
export function clippedSpan(lowV: number, highV: number, window: ScreenWindow): { lowV: number; highV: number } {
  const clamp = (v: number) => Math.min(window.topV, Math.max(window.bottomV, v));
  return { lowV: clamp(lowV), highV: clamp(highV) };
}

/**
 * The span the trace covers on the screen's scale when nothing cuts it: true levels ×
 * channel setting ÷ probe attenuation. A sine's low level defaults to −A/2, others' to 0;
 * a DC level sits at base + A.
 */
export function shownSpanV(setup: ResolvedSetup): { lowV: number; highV: number } | undefined {
  const amplitudeV = setup.expectedAmplitudeV;
  if (amplitudeV === undefined) return undefined;
  const scale = setup.channelSetting / setup.probeAttenuation;
  const baseV = setup.baseV ?? (setup.signalKind === 'sine' ? -amplitudeV / 2 : 0);
  if (setup.signalKind === 'dc') return { lowV: (baseV + amplitudeV) * scale, highV: (baseV + amplitudeV) * scale };
  return { lowV: baseV * scale, highV: (baseV + amplitudeV) * scale };
}

/**
 * What the recorded screen window leaves of a trace another cause predicts, for combining
 * clipping with it: the signal's span scaled so its height is `shownAmplitudeV` (the low
 * level scales with it), then cut to the window. Undefined when no scale or amplitude is
 * recorded, or for a DC level (compare the level itself).
 *
 * @param shownAmplitudeV the other cause's predicted amplitude on the screen's scale, V
 */
export function clippedAmplitudeV(setup: ResolvedSetup, shownAmplitudeV: number): number | undefined {
  const amplitudeV = setup.expectedAmplitudeV;
  if (setup.voltsPerDiv === undefined || amplitudeV === undefined || amplitudeV <= 0 || setup.signalKind === 'dc') return undefined;
  const baseV = setup.baseV ?? (setup.signalKind === 'sine' ? -amplitudeV / 2 : 0);
  const gain = shownAmplitudeV / amplitudeV;
  const window = screenWindow(setup.voltsPerDiv, setup.offsetV ?? 0, setup.divisions);
  const kept = clippedSpan(baseV * gain, (baseV + amplitudeV) * gain, window);
  return kept.highV - kept.lowV;
}

/** Driven further than this share of the screen height beyond an edge, an input may recover slowly (our threshold). */
const OVERDRIVE_SHARE = 0.5;
// our estimates: how often an unrecorded (or misremembered) scale or offset cuts the trace
const HIDDEN_WINDOW_PRIOR = { unrecorded: 0.3, recorded: 0.1 } as const;

/** Clipping candidates: the recorded screen window, and a window an observed clipped trace implies. */
export function assessClipping({ setup, observed }: ModelContext): Candidate[] {
  const recorded = recordedWindow(setup);
  const candidates = [recorded];
  if (observed.clipped !== true || recorded.estimates?.[SCREEN_ESTIMATE] === 'clipped') return candidates;
  const span = shownSpanV(setup);
  const shownFullV = span === undefined ? undefined : span.highV - span.lowV || Math.abs(span.highV);
  const seenV = observed.amplitudeV;
  const fitsAmplitude = seenV !== undefined && shownFullV !== undefined && seenV < shownFullV;
  const impliedVoltsPerDiv = seenV === undefined ? undefined : seenV / setup.divisions;
  const recordedScale = setup.voltsPerDiv;
  const contradicts = recordedScale !== undefined && impliedVoltsPerDiv !== undefined && recordedScale > impliedVoltsPerDiv * 1.05;
  candidates.push({
    cause: 'clipping',
    basis: 'fitted',
    hiddenPrior: recordedScale === undefined ? HIDDEN_WINDOW_PRIOR.unrecorded : HIDDEN_WINDOW_PRIOR.recorded,
    deviation: fitsAmplitude ? Math.log((shownFullV as number) / (seenV as number)) : Math.log(1.2),
    predicted: fitsAmplitude ? { amplitudeV: seenV } : {},
    explanation:
      'The trace was seen running into the edge of the screen, where the scope cuts it: the scale or offset was set so part of the signal lies outside the window' +
      (fitsAmplitude && impliedVoltsPerDiv !== undefined
        ? `. The ${eng(seenV as number, 'V')} left of ${eng(shownFullV as number, 'V')} fits a window of about ${eng(impliedVoltsPerDiv, 'V')}/div over ${factor(setup.divisions)} divisions, or an offset that pushes the rest off screen.`
        : '.') +
      ' What was cut is not measured: amplitude, overshoot and tops read from a clipped trace are wrong.',
    confirm: CONFIRM,
    fix: FIX,
    estimates: {
      [SCREEN_ESTIMATE]: 'clipped',
      ...(impliedVoltsPerDiv === undefined ? {} : { impliedVoltsPerDiv }),
    },
    ...(contradicts ? { contradictions: [{ field: 'scope.voltsPerDiv', recorded: recordedScale, implied: impliedVoltsPerDiv as number }] } : {}),
    detailTags: ['clipped-trace'],
  });
  return candidates;
}

const FIX =
  'Choose a scale that puts the whole signal on about six of the eight divisions and centre it with the offset; to look closely at a small part of a large signal, accept that the input may be overdriven and allow for its recovery time.';

function recordedWindow(setup: ResolvedSetup): Candidate {
  const common = { cause: 'clipping' as const, basis: 'recorded' as const, confirm: CONFIRM };
  const span = shownSpanV(setup);
  if (setup.voltsPerDiv === undefined || span === undefined) {
    return {
      ...common,
      deviation: 0,
      predicted: {},
      explanation:
        setup.voltsPerDiv === undefined
          ? 'No vertical scale is recorded, so the setup does not say whether the trace fits on the screen.'
          : 'No expected amplitude is recorded, so the setup does not say whether the trace fits on the screen.',
      fix: 'Note the V/div and offset the channel was set to, and the amplitude expected.',
      detailTags: [],
    };
  }
  const offsetV = setup.offsetV ?? 0;
  const window = screenWindow(setup.voltsPerDiv, offsetV, setup.divisions);
  const kept = clippedSpan(span.lowV, span.highV, window);
  const dc = setup.signalKind === 'dc';
  const fullV = dc ? Math.abs(span.highV) : span.highV - span.lowV;
  const keptV = dc ? Math.abs(kept.highV) : kept.highV - kept.lowV;
  const cut = dc ? kept.highV !== span.highV : keptV < fullV * (1 - 1e-9);
  const windowText = `The screen shows ${eng(window.bottomV, 'V')} to ${eng(window.topV, 'V')} (${factor(setup.divisions)} divisions of ${eng(setup.voltsPerDiv, 'V')}, centre at ${eng(offsetV, 'V')}${setup.offsetV === undefined ? ', offset taken as 0' : ''})`;
  const spanText = dc ? `the ${eng(span.highV, 'V')} level` : `the trace spans ${eng(span.lowV, 'V')} to ${eng(span.highV, 'V')}`;
  if (!cut) {
    return {
      ...common,
      deviation: 0,
      predicted: { amplitudeV: dc ? Math.abs(span.highV) : fullV },
      explanation: `${windowText}, and ${spanText} fits inside it.`,
      fix: 'Nothing to change.',
      estimates: { [SCREEN_ESTIMATE]: 'fits' },
      detailTags: [],
    };
  }
  const heightV = window.topV - window.bottomV;
  const beyondV = Math.max(span.highV - window.topV, window.bottomV - span.lowV, 0);
  const overdriven = beyondV > OVERDRIVE_SHARE * heightV;
  const sharePct = fullV > 0 ? 100 * (1 - keptV / fullV) : 100;
  return {
    ...common,
    // A trace cut to nothing shows a line pinned at the edge: count it as 100× off.
    deviation: keptV > fullV * 1e-2 ? Math.log(fullV / keptV) : Math.log(100),
    predicted: keptV > 0 ? { amplitudeV: keptV } : {},
    explanation:
      `${windowText}, but ${spanText}: ${percent(sharePct)} of it lies outside and is cut flat at the edge, so the screen shows ${eng(keptV, 'V')} instead of ${eng(fullV, 'V')}.` +
      (overdriven
        ? ` The input is driven ${eng(beyondV, 'V')} past the edge, more than half a screen: its amplifier saturates and may take a while to recover, smearing what follows each cut.`
        : ''),
    fix: FIX,
    estimates: { [SCREEN_ESTIMATE]: 'clipped', screenBottomV: window.bottomV, screenTopV: window.topV, clippedSharePct: sharePct },
    detailTags: overdriven ? ['clipped-trace', 'overdriven-input'] : ['clipped-trace'],
  };
}
