import type { Risk } from '../schemas/diagnosis';
import { hazardousLive, type VoltageKind } from '../safety/hazard';
import type { ResolvedSetup } from './types';
import { eng } from './wording';

/** A reference node within this of earth counts as earthed (our tolerance: ground bounce, shunt drops). */
export const EARTHED_TOLERANCE_V = 1;

/**
 * Peak voltage from earth at the probe tip: the reference node's voltage plus the larger of
 * the signal's low and high levels (low = baseV, default 0, a sine's −A/2; high = low + A).
 * Signs are not trusted to cancel, so magnitudes add: the worst case.
 */
export function tipPeakFromEarthV(setup: ResolvedSetup): number | undefined {
  const amplitude = setup.expectedAmplitudeV;
  if (amplitude === undefined && setup.referenceV === undefined) return undefined;
  const a = amplitude ?? 0;
  const low = setup.baseV ?? (setup.signalKind === 'sine' ? -a / 2 : 0);
  const signalPeak = Math.max(Math.abs(low), Math.abs(low + a));
  return Math.abs(setup.referenceV ?? 0) + signalPeak;
}

/**
 * Safety risks from every voltage the case records: the tip's peak from earth (expected
 * amplitude, base level and reference node), the highest voltage present, the mains
 * connection, and a passive probe's ground clip on a node away from earth.
 */
export function setupRisks(setup: ResolvedSetup): Risk[] {
  const risks: Risk[] = [];
  const follow = ' Read the safety caution before probing and follow local codes and licensed practice.';

  const tipV = tipPeakFromEarthV(setup);
  // a reference node may swing (a switch node), so only a DC signal on an earthed reference reads as DC
  const tipKind: VoltageKind = setup.signalKind === 'dc' && setup.referenceV === undefined ? 'dc' : 'peak';
  const levels = [
    tipV === undefined ? undefined : { what: 'At the probe tip', ...hazardousLive({ highestVoltageV: tipV, kind: tipKind }) },
    // a bare "highest voltage" may be rms: read it against the strictest level
    setup.highestVoltageV === undefined ? undefined : { what: 'In the circuit', ...hazardousLive({ highestVoltageV: setup.highestVoltageV }) },
  ].filter((x) => x !== undefined);
  const hazard = levels.filter((l) => l.hazardous);
  const caution = levels.filter((l) => l.caution);
  if (hazard.length) {
    risks.push({ id: 'hazardous-live', level: 'hazard', message: hazard.map((l) => `${l.what}: ${l.reasons.join(' ')}`).join(' ') + follow });
  } else if (caution.length) {
    risks.push({ id: 'elevated-voltage', level: 'caution', message: caution.map((l) => `${l.what}: ${l.reasons.join(' ')}`).join(' ') + follow });
  }

  if (setup.mainsConnected) {
    risks.push({
      id: 'mains-connected',
      level: 'caution',
      message:
        "The equipment is connected to the mains: parts of it may be hazardous live, and a passive probe's ground clip is bonded to protective earth through the scope." +
        follow,
    });
  }

  const ref = setup.referenceV;
  const passive = setup.probeKind === 'passive';
  if (passive && ref !== undefined && Math.abs(ref) > EARTHED_TOLERANCE_V) {
    risks.push({
      id: 'ground-clip-off-earth',
      level: 'hazard',
      message: `The probe's ground is on a node ${eng(Math.abs(ref), 'V')} from earth. A passive probe's ground clip is bonded to protective earth through the scope, so it shorts that node to earth: a fault current, damage and a shock risk, never a measurement. Use a differential or isolated probe, and never float the scope.${follow}`,
    });
  }
  return risks;
}
