import { formatEngineering } from '../units/engineering';
import { HAZARDOUS_LIVE_LIMITS, hazardousLive } from './hazard';

/**
 * Levels above which an accessible part is hazardous live.
 * source: IEC 61010-1:2010, 6.3.1 (normal condition: 33 V rms, 46.7 V peak or 70 V DC; wet
 * locations: 16 V rms, 22.6 V peak or 35 V DC)
 */
export const IEC_61010_HAZARDOUS_LIVE = {
  normal: { acRmsV: 33, peakV: 46.7, dcV: 70 },
  wet: { acRmsV: 16, peakV: 22.6, dcV: 35 },
} as const;

type Levels = { acRmsV: number; peakV: number; dcV: number };
const levels = (l: Levels) => `${l.acRmsV} V rms, ${l.peakV} V peak or ${l.dcV} V DC`;

/**
 * The citation shown with every safety caution, and, when the app warns from lower levels of
 * its own, those levels labelled as ours.
 */
export function hazardousLiveCitation(ours: Levels = HAZARDOUS_LIVE_LIMITS): string {
  const { normal, wet } = IEC_61010_HAZARDOUS_LIVE;
  const standard = `IEC 61010-1:2010, 6.3.1 treats a part as hazardous live above ${levels(normal)} in normal conditions (${levels(wet)} in wet locations).`;
  const same = ours.acRmsV === normal.acRmsV && ours.peakV === normal.peakV && ours.dcV === normal.dcV;
  return same ? standard : `${standard} Falsetrace warns from its own, more cautious levels: ${levels(ours)}.`;
}

/**
 * Reasons for the caution read from the recorded setup alone (a floor under the engine's risks),
 * worded so our own warning level is never passed off as the standard's.
 */
export function setupSafetyReasons(
  circuit: { mainsConnected?: boolean | null; highestVoltageV?: number | null; referenceV?: number | null } | null | undefined,
): string[] {
  const reasons: string[] = [];
  if (circuit?.mainsConnected) reasons.push('The equipment is connected to the mains.');
  const volts = circuit?.highestVoltageV;
  if (typeof volts === 'number' && hazardousLive({ highestVoltageV: volts }).hazardous) {
    reasons.push(`${formatEngineering(Math.abs(volts), 'V')} is present in the circuit, above the level from which Falsetrace cautions.`);
  }
  const ref = circuit?.referenceV;
  if (typeof ref === 'number' && hazardousLive({ highestVoltageV: ref, kind: 'peak' }).hazardous) {
    reasons.push(`The probe's ground or reference sits on a node ${formatEngineering(Math.abs(ref), 'V')} from earth, above the level from which Falsetrace cautions.`);
  }
  return reasons;
}
