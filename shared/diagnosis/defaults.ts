import type { Assumption, DiagnosisInput, SignalKind } from '../schemas/diagnosis';
import type { Observed, ResolvedSetup } from './types';

/** Typical values used when a case leaves a field out. Each one is shown to the user. */
export const TYPICAL = {
  probeAttenuation: 10, // common practice: the passive probe shipped with most scopes
  scopeInputResistanceOhm: 1e6, // common practice
  scopeInputCapacitanceF: 15e-12, // common practice: general-purpose inputs are 10–20 pF
  probeDesignInputOhm: 1e6, // common practice: passive probes are built for a 1 MΩ input
  attenuatingTipCapacitanceF: 12e-12, // common practice: 10x passive probes, about 10–15 pF
  oneXTipCapacitanceF: 100e-12, // common practice: 1x probe, cable and input together
  oneXBandwidthHz: 6e6, // common practice: 1x passive probes, a few MHz
  activeTipResistanceOhm: 1e6, // common practice: single-ended active (FET) probes, about 1 MΩ at the tip
  activeTipCapacitanceF: 1e-12, // common practice: single-ended active (FET) probes, under 1 pF to about 1 pF
  clipLeadM: 0.15, // common practice: the alligator ground lead in the probe kit
  springLeadM: 0.01, // common practice: ground spring fitted over the tip barrel
  groundWireRadiusM: 0.25e-3, // common practice: ground lead wire about 0.5 mm across
  sourceResistanceOhm: 50, // common practice: generator outputs and many driver outputs
  divisions: 8, // common practice: eight vertical divisions on most screens
} as const;

const given = <T>(value: T | null | undefined): value is T => value !== null && value !== undefined;

/**
 * Fills the gaps in a case's setup with typical values and lists each filled value as an
 * assumption the user can see and correct.
 */
export function resolveSetup(input: DiagnosisInput): {
  setup: ResolvedSetup;
  assumptions: Assumption[];
} {
  const probe = input.probe ?? {};
  const scope = input.scope ?? {};
  const signal = input.signal ?? {};
  const circuit = input.circuit ?? {};
  const assumptions: Assumption[] = [];
  const assume = (field: string, value: number | string, unit: string, why: string) => {
    assumptions.push({ field, value, unit, why });
  };

  let probeAttenuation = probe.attenuation;
  let channelSetting = scope.attenuationSetting;
  if (!given(probeAttenuation) && !given(channelSetting)) {
    probeAttenuation = channelSetting = TYPICAL.probeAttenuation;
    assume('probe.attenuation', probeAttenuation, '', 'Not recorded: a 10x passive probe, the usual bench default.');
    assume('scope.attenuationSetting', channelSetting, '', 'Not recorded: taken to match the probe.');
  } else if (!given(channelSetting)) {
    channelSetting = probeAttenuation as number;
    assume('scope.attenuationSetting', channelSetting, '', 'Not recorded: taken to match the probe.');
  } else if (!given(probeAttenuation)) {
    probeAttenuation = channelSetting;
    assume(
      'probe.attenuation',
      probeAttenuation,
      '',
      "Not recorded: taken to match the channel setting. Most scopes cannot sense a switchable probe's position, so check it.",
    );
  }
  const attenuation = probeAttenuation as number;
  const probeKind = probe.kind ?? 'passive';
  // a buffered probe's input does not follow its ratio: an active probe at 1:1 is no 1x passive probe
  const active = probeKind === 'active';
  const oneX = attenuation === 1 && !active;

  const scopeInputResistanceOhm = scope.inputResistanceOhm ?? TYPICAL.scopeInputResistanceOhm;
  if (!given(scope.inputResistanceOhm)) {
    assume('scope.inputResistanceOhm', scopeInputResistanceOhm, 'Ω', 'Not recorded: the usual 1 MΩ high-impedance input.');
  }
  const scopeInputCapacitanceF = scope.inputCapacitanceF ?? TYPICAL.scopeInputCapacitanceF;
  if (!given(scope.inputCapacitanceF)) {
    assume('scope.inputCapacitanceF', scopeInputCapacitanceF, 'F', 'Not recorded: a typical general-purpose input.');
  }

  if (given(scope.inputCapacitanceF) && !oneX && probeKind === 'passive') {
    assume(
      'probe.compensatedOnInputCapacitanceF',
      TYPICAL.scopeInputCapacitanceF,
      'F',
      "Not recorded: the probe is taken to have been last adjusted on a typical 15 pF input, so a recorded input capacitance that differs shifts its compensation until the trimmer is turned on this scope.",
    );
  }

  let tipResistanceOhm = probe.tipResistanceOhm ?? (active ? TYPICAL.activeTipResistanceOhm : (attenuation - 1) * TYPICAL.probeDesignInputOhm);
  if (!given(probe.tipResistanceOhm)) {
    assume(
      'probe.tipResistanceOhm',
      tipResistanceOhm,
      'Ω',
      active
        ? 'Not recorded: a single-ended active probe presents about 1 MΩ at its tip, whatever its ratio; its buffer, not the tip, drives the scope input.'
        : oneX
          ? 'Not recorded: a 1x probe is a plain conductor to the input.'
          : 'Not recorded: a passive probe is built to divide into a 1 MΩ input, so its tip resistor is (ratio − 1) × 1 MΩ.',
    );
  }
  tipResistanceOhm = Math.max(0, tipResistanceOhm);

  let tipCapacitanceF = probe.tipCapacitanceF;
  if (!given(tipCapacitanceF)) {
    // The cable dominates a 1x probe's load, so only the input's share follows scope.inputCapacitanceF.
    tipCapacitanceF = active
      ? TYPICAL.activeTipCapacitanceF
      : oneX
        ? TYPICAL.oneXTipCapacitanceF - TYPICAL.scopeInputCapacitanceF + scopeInputCapacitanceF
        : TYPICAL.attenuatingTipCapacitanceF;
    assume(
      'probe.tipCapacitanceF',
      tipCapacitanceF,
      'F',
      active
        ? 'Not recorded: a single-ended active probe presents about 1 pF at its tip.'
        : oneX
          ? 'Not recorded: a 1x probe loads the circuit with its cable and the scope input, about 100 pF.'
          : 'Not recorded: a typical 10x passive probe presents about 12 pF at the tip.',
    );
  }

  // An unrecorded probe bandwidth means a probe matched to its scope: the scope's figure is the
  // system's, so the probe is not a second stage. A 1x probe is the exception: its own few MHz.
  let probeBandwidthHz = probe.bandwidthHz ?? undefined;
  if (!given(probeBandwidthHz)) {
    if (oneX) {
      probeBandwidthHz = TYPICAL.oneXBandwidthHz;
      assume('probe.bandwidthHz', probeBandwidthHz, 'Hz', 'Not recorded: 1x passive probes reach only a few MHz.');
    } else if (given(scope.bandwidthHz) || given(scope.riseTimeS)) {
      assume('probe.bandwidthHz', 'matched to the scope', '', "Not recorded: the probe is taken to be matched to the scope, so the scope's bandwidth is the system's and the probe adds no stage of its own.");
    }
  }

  const groundKind = probe.groundKind ?? 'clip-lead';
  if (!given(probe.groundKind)) {
    assume('probe.groundKind', groundKind, '', 'Not recorded: the clip lead that comes with the probe.');
  }
  let groundLeadM = probe.groundLeadM ?? undefined;
  if (!given(groundLeadM) && groundKind !== 'none') {
    groundLeadM = groundKind === 'spring' ? TYPICAL.springLeadM : TYPICAL.clipLeadM;
    assume(
      'probe.groundLeadM',
      groundLeadM,
      'm',
      groundKind === 'spring'
        ? 'Not recorded: a ground spring adds about 1 cm of return path.'
        : 'Not recorded: the clip lead in a probe kit is about 15 cm long.',
    );
  }
  const groundWireRadiusM = probe.groundWireRadiusM ?? TYPICAL.groundWireRadiusM;
  if (!given(probe.groundWireRadiusM) && given(groundLeadM) && groundLeadM > 0) {
    assume('probe.groundWireRadiusM', groundWireRadiusM, 'm', 'Not recorded: ground leads are wire about 0.5 mm across.');
  }

  const sourceResistanceOhm = input.circuit?.sourceResistanceOhm ?? TYPICAL.sourceResistanceOhm;
  if (!given(input.circuit?.sourceResistanceOhm)) {
    assume('circuit.sourceResistanceOhm', sourceResistanceOhm, 'Ω', 'Not recorded: a typical generator or driver output.');
  }

  const observed = observedOf(input);
  const frequencyHz = signal.frequencyHz ?? undefined;
  const signalRiseTimeS = signal.riseTimeS ?? undefined;
  const edgeSeen = given(observed.riseTimeS) || given(observed.overshootPct) || given(observed.ringingFrequencyHz);
  let signalKind: SignalKind | undefined = signal.kind ?? undefined;
  if (!given(signalKind)) {
    signalKind = given(frequencyHz) ? 'square' : given(signalRiseTimeS) || edgeSeen ? 'pulse' : 'dc';
    const why: Record<SignalKind, string> = {
      square: 'Not recorded: a periodic signal is taken to be a square wave or clock, the usual probing subject.',
      pulse: 'Not recorded: edges were described but no frequency, so a single edge is assumed.',
      dc: 'Not recorded: no frequency or edge was given, so a DC level is assumed.',
      sine: '',
      other: '',
    };
    assume('signal.kind', signalKind, '', why[signalKind]);
  }
  if (!given(frequencyHz) && signalKind !== 'dc') {
    const why =
      signalKind === 'pulse'
        ? 'Not recorded: a single edge between two steady levels.'
        : 'Not recorded: treated as DC for loading and amplitude.';
    assume('signal.frequencyHz', 0, 'Hz', why);
  }
  const hasEdges =
    signalKind === 'square' ||
    signalKind === 'pulse' ||
    (signalKind === 'other' && (given(signalRiseTimeS) || edgeSeen));

  const setup: ResolvedSetup = {
    probeAttenuation: attenuation,
    channelSetting: channelSetting as number,
    tipResistanceOhm,
    tipCapacitanceF,
    probeBandwidthHz,
    groundKind,
    groundLeadM,
    groundWireRadiusM,
    scopeInputResistanceOhm,
    scopeInputCapacitanceF,
    scopeBandwidthHz: scope.bandwidthHz ?? undefined,
    bandwidthLimitHz: scope.bandwidthLimitHz ?? undefined,
    sourceResistanceOhm,
    expectedAmplitudeV: signal.expectedAmplitudeV ?? undefined,
    frequencyHz,
    signalRiseTimeS,
    signalKind,
    hasEdges,
    probeKind,
    probeCmrrDb: probe.cmrrDb ?? undefined,
    scopeRiseTimeS: scope.riseTimeS ?? undefined,
    coupling: scope.coupling ?? 'dc',
    couplingRecorded: scope.coupling !== undefined && scope.coupling !== null,
    acCornerHz: scope.acCornerHz ?? undefined,
    sampleRateHz: scope.sampleRateHz ?? undefined,
    voltsPerDiv: scope.voltsPerDiv ?? undefined,
    offsetV: scope.offsetV ?? undefined,
    divisions: scope.divisions ?? TYPICAL.divisions,
    loadResistanceOhm: circuit.loadResistanceOhm ?? undefined,
    referenceV: circuit.referenceV ?? undefined,
    highestVoltageV: circuit.highestVoltageV ?? undefined,
    mainsConnected: circuit.mainsConnected ?? undefined,
    mainsFrequencyHz: circuit.mainsFrequencyHz ?? undefined,
    baseV: signal.baseV ?? undefined,
    generatorLoad: signal.generatorLoad ?? undefined,
    assumed: new Set(assumptions.map((a) => a.field)),
  };
  return { setup, assumptions };
}

/**
 * A 1x passive probe: a plain wire and its cable, with a few MHz of bandwidth. A buffered or
 * clamp-on probe at 1:1 is not one (the advice to use a 10x probe is not for it).
 */
export const isOneXPassive = (setup: ResolvedSetup): boolean => setup.probeAttenuation === 1 && setup.probeKind === 'passive';

/** The observation with nulls dropped (the schema has already removed unknown keys). */
export function observedOf(input: DiagnosisInput): Observed {
  const entries = Object.entries(input.observed ?? {}).filter(([, value]) => value !== null && value !== undefined);
  return Object.fromEntries(entries) as Observed;
}

/**
 * The recorded setup with a switchable probe in another position: a 1x position is a plain
 * wire with the cable's ~100 pF and a few MHz of bandwidth; an attenuating one has its tip
 * resistor into the 1 MΩ design input and typical tip capacitance, matched to the scope.
 * Values recorded for the probe describe the position the record believed in, so they give way.
 */
export function withSwitchPosition(setup: ResolvedSetup, ratio: number): ResolvedSetup {
  if (ratio === setup.probeAttenuation) return setup;
  const oneX = ratio === 1;
  return {
    ...setup,
    probeAttenuation: ratio,
    tipResistanceOhm: (ratio - 1) * TYPICAL.probeDesignInputOhm,
    tipCapacitanceF: oneX
      ? TYPICAL.oneXTipCapacitanceF - TYPICAL.scopeInputCapacitanceF + setup.scopeInputCapacitanceF
      : TYPICAL.attenuatingTipCapacitanceF,
    probeBandwidthHz: oneX ? TYPICAL.oneXBandwidthHz : undefined,
  };
}
