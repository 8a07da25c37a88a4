import { formatEngineering } from '../units/engineering';

/**
 * Hazardous-live levels for dry locations in normal condition.
 * source: IEC 61010-1:2010, 6.3.1 (values as DESIGN.md states them)
 * from memory: the third edition's 6.3.1 may list 33 V rms / 46.7 V peak / 70 V DC, while
 * 30 / 42.4 / 60 V are the levels printed on probe and scope safety sheets; the lower set is
 * the cautious choice, so it is used until someone checks the standard's text.
 */
export const HAZARDOUS_LIVE_LIMITS = {
  acRmsV: 30,
  peakV: 42.4,
  dcV: 60,
} as const;

export type VoltageKind = 'dc' | 'ac-rms' | 'peak';

export interface HazardQuery {
  /** The equipment under test is connected to the mains. */
  mainsConnected?: boolean;
  /** Highest voltage a probe or lead may touch, in V (sign ignored). */
  highestVoltageV?: number;
  /** How `highestVoltageV` is expressed; when unknown it is read as an AC rms value, the strictest limit. */
  kind?: VoltageKind;
}

export interface HazardAssessment {
  hazardous: boolean;
  reasons: string[];
}

/**
 * Decides whether a case needs the safety caution: mains-connected equipment, or a voltage
 * above the IEC 61010-1 hazardous-live levels (30 V rms, 42.4 V peak, 60 V DC). A voltage
 * exactly at a limit is not above it.
 */
export function hazardousLive(query: HazardQuery): HazardAssessment {
  const reasons: string[] = [];
  if (query.mainsConnected) {
    reasons.push('The equipment is connected to the mains.');
  }
  const volts = query.highestVoltageV;
  if (volts !== undefined && Number.isFinite(volts)) {
    const magnitude = Math.abs(volts);
    const kind = query.kind ?? 'ac-rms';
    const limit = limitFor(kind);
    if (magnitude > limit.volts) {
      reasons.push(
        `${formatEngineering(magnitude, 'V')} ${limit.label} is above the ${limit.volts} V ${limit.label} hazardous-live level.`,
      );
    }
  }
  return { hazardous: reasons.length > 0, reasons };
}

function limitFor(kind: VoltageKind): { volts: number; label: string } {
  switch (kind) {
    case 'dc':
      return { volts: HAZARDOUS_LIVE_LIMITS.dcV, label: 'DC' };
    case 'peak':
      return { volts: HAZARDOUS_LIVE_LIMITS.peakV, label: 'peak' };
    case 'ac-rms':
      return { volts: HAZARDOUS_LIVE_LIMITS.acRmsV, label: 'rms' };
  }
}

/** The caution shown beside hazardous cases. */
export const SAFETY_CAUTIONS: readonly string[] = [
  'The ground clip of a passive probe is bonded to protective earth through the scope: clipped to any point that is not at earth potential, it makes a short circuit.',
  'Never float the scope by lifting or defeating its protective earth; its chassis and every probe ground would then sit at the circuit voltage.',
  'Measure points that are not earth-referenced with a differential probe or an isolated-input instrument.',
  "Check the probe's voltage rating and measurement category before connecting, and how that rating falls as frequency rises.",
  'Follow local electrical codes, and leave work on mains equipment to people licensed and trained for it.',
];
