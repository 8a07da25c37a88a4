import { formatEngineering } from '../units/engineering';

/**
 * Hazardous-live levels for normal conditions: 33 V rms, 46.7 V peak or 70 V DC.
 * source: IEC 61010-1:2010, 6.3.1 a) (levels of accessible voltage in normal condition).
 */
export const HAZARDOUS_LIVE_LIMITS = {
  acRmsV: 33,
  peakV: 46.7,
  dcV: 70,
} as const;

/**
 * The same levels for wet locations: 16 V rms, 22.6 V peak or 35 V DC.
 * source: IEC 61010-1:2010, 6.3.1 a) (equipment intended for use in wet locations).
 */
export const WET_LOCATION_LIMITS = {
  acRmsV: 16,
  peakV: 22.6,
  dcV: 35,
} as const;

/**
 * Our own, lower warning threshold: Falsetrace starts cautioning at the wet-location levels
 * whatever the location, because a bench case rarely records how damp or how long the contact
 * may be. This is our choice, not the standard's hazard level.
 */
export const CAUTION_LIMITS = WET_LOCATION_LIMITS;

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
  /** Mains-connected, or above the standard's hazardous-live level. */
  hazardous: boolean;
  /** Above our lower warning threshold (the wet-location levels) but not hazardous by the standard. */
  caution: boolean;
  reasons: string[];
}

const LABEL: Record<VoltageKind, string> = { dc: 'DC', peak: 'peak', 'ac-rms': 'rms' };
const KEY: Record<VoltageKind, 'dcV' | 'peakV' | 'acRmsV'> = { dc: 'dcV', peak: 'peakV', 'ac-rms': 'acRmsV' };

/**
 * Decides whether a case needs the safety caution: mains-connected equipment, or a voltage
 * above the IEC 61010-1:2010 6.3.1 hazardous-live levels for normal conditions (33 V rms,
 * 46.7 V peak, 70 V DC). A voltage above the wet-location levels (16 V rms, 22.6 V peak,
 * 35 V DC) but not the normal ones raises our own, lower caution. A voltage exactly at a
 * limit is not above it.
 */
export function hazardousLive(query: HazardQuery): HazardAssessment {
  const reasons: string[] = [];
  let hazardous = false;
  let caution = false;
  if (query.mainsConnected) {
    hazardous = true;
    reasons.push('The equipment is connected to the mains.');
  }
  const volts = query.highestVoltageV;
  if (volts !== undefined && Number.isFinite(volts)) {
    const magnitude = Math.abs(volts);
    const kind = query.kind ?? 'ac-rms';
    const hazardLevel = HAZARDOUS_LIVE_LIMITS[KEY[kind]];
    const cautionLevel = CAUTION_LIMITS[KEY[kind]];
    const shown = `${formatEngineering(magnitude, 'V')} ${LABEL[kind]}`;
    if (magnitude > hazardLevel) {
      hazardous = true;
      reasons.push(`${shown} is above the ${hazardLevel} V ${LABEL[kind]} hazardous-live level of IEC 61010-1:2010, 6.3.1.`);
    } else if (magnitude > cautionLevel) {
      caution = true;
      reasons.push(
        `${shown} is above ${cautionLevel} V ${LABEL[kind]}, the standard's wet-location level, which Falsetrace uses as its own lower warning threshold (the normal-condition level is ${hazardLevel} V).`,
      );
    }
  }
  return { hazardous, caution, reasons };
}

/** The caution shown beside hazardous cases. */
export const SAFETY_CAUTIONS: readonly string[] = [
  'The ground clip of a passive probe is bonded to protective earth through the scope: clipped to any point that is not at earth potential, it makes a short circuit.',
  'Never float the scope by lifting or defeating its protective earth; its chassis and every probe ground would then sit at the circuit voltage.',
  'Measure points that are not earth-referenced with a differential probe or an isolated-input instrument.',
  "Check the probe's voltage rating and measurement category before connecting, and how that rating falls as frequency rises.",
  'IEC 61010-1:2010, 6.3.1 treats more than 33 V rms, 46.7 V peak or 70 V DC as hazardous live in normal conditions (16 V rms, 22.6 V peak, 35 V DC in wet locations); Falsetrace cautions from the wet-location levels, a lower threshold of our own.',
  'Follow local electrical codes, and leave work on mains equipment to people licensed and trained for it.',
];
