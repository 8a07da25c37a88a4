import { describe, expect, it } from 'vitest';
import { CAUTION_LIMITS, HAZARDOUS_LIVE_LIMITS, SAFETY_CAUTIONS, WET_LOCATION_LIMITS, hazardousLive } from '../../shared/safety/hazard';
import { diagnose } from '../../shared/diagnosis/ranker';

describe('hazardousLive', () => {
  // source: IEC 61010-1:2010, 6.3.1 a): 33 V rms, 46.7 V peak, 70 V DC in normal condition
  it('should use the hazardous-live levels of IEC 61010-1 for normal conditions', () => {
    expect(HAZARDOUS_LIVE_LIMITS).toEqual({ acRmsV: 33, peakV: 46.7, dcV: 70 });
  });

  // source: IEC 61010-1:2010, 6.3.1 a): 16 V rms, 22.6 V peak, 35 V DC in wet locations
  it('should know the wet-location levels and use them as its own, lower warning threshold', () => {
    expect(WET_LOCATION_LIMITS).toEqual({ acRmsV: 16, peakV: 22.6, dcV: 35 });
    expect(CAUTION_LIMITS).toEqual(WET_LOCATION_LIMITS);
    const result = hazardousLive({ highestVoltageV: 24, kind: 'ac-rms' });
    expect(result).toMatchObject({ hazardous: false, caution: true });
    expect(result.reasons[0]).toMatch(/own lower warning threshold/);
  });

  it('should treat a value exactly at a limit as not above it', () => {
    expect(hazardousLive({ highestVoltageV: 33, kind: 'ac-rms' }).hazardous).toBe(false);
    expect(hazardousLive({ highestVoltageV: 46.7, kind: 'peak' }).hazardous).toBe(false);
    expect(hazardousLive({ highestVoltageV: 70, kind: 'dc' }).hazardous).toBe(false);
  });

  it('should flag values just above each limit', () => {
    expect(hazardousLive({ highestVoltageV: 33.1, kind: 'ac-rms' }).hazardous).toBe(true);
    expect(hazardousLive({ highestVoltageV: 46.8, kind: 'peak' }).hazardous).toBe(true);
    expect(hazardousLive({ highestVoltageV: 70.1, kind: 'dc' }).hazardous).toBe(true);
  });

  it('should apply the limit for the kind of voltage given', () => {
    // 48 V DC telecom rail: below 70 V DC, but above 33 V if it were an rms figure
    expect(hazardousLive({ highestVoltageV: 48, kind: 'dc' }).hazardous).toBe(false);
    expect(hazardousLive({ highestVoltageV: 48, kind: 'ac-rms' }).hazardous).toBe(true);
    expect(hazardousLive({ highestVoltageV: -75, kind: 'dc' }).hazardous).toBe(true);
  });

  it('should read a voltage of unknown kind against the strictest (rms) limit', () => {
    expect(hazardousLive({ highestVoltageV: 35 }).hazardous).toBe(true);
    expect(hazardousLive({ highestVoltageV: 12 }).hazardous).toBe(false);
  });

  it('should flag mains-connected equipment whatever the probed voltage', () => {
    const result = hazardousLive({ mainsConnected: true, highestVoltageV: 3.3, kind: 'dc' });
    expect(result.hazardous).toBe(true);
    expect(result.reasons).toEqual(['The equipment is connected to the mains.']);
  });

  it('should give one reason per cause, citing the standard', () => {
    const result = hazardousLive({ mainsConnected: true, highestVoltageV: 325, kind: 'peak' });
    expect(result.reasons).toHaveLength(2);
    expect(result.reasons[1]).toBe('325 V peak is above the 46.7 V peak hazardous-live level of IEC 61010-1:2010, 6.3.1.');
  });

  it('should not flag an empty query', () => {
    expect(hazardousLive({})).toEqual({ hazardous: false, caution: false, reasons: [] });
  });

  it('should cover every point of the safety caution and cite the figures correctly', () => {
    const text = SAFETY_CAUTIONS.join(' ');
    expect(text).toMatch(/protective earth/);
    expect(text).toMatch(/float/);
    expect(text).toMatch(/differential probe|isolated/);
    expect(text).toMatch(/measurement category/);
    expect(text).toMatch(/frequency/);
    expect(text).toMatch(/local electrical codes/);
    expect(text).toMatch(/33 V rms, 46\.7 V peak or 70 V DC/);
    expect(text).not.toMatch(/42\.4|30 V rms|60 V DC/);
  });
});

describe('risks in diagnose', () => {
  it('should look at the reference node, not only the expected amplitude: a 12 V gate on a 400 V switch node', () => {
    const result = diagnose({ signal: { expectedAmplitudeV: 12, kind: 'square', frequencyHz: 100e3 }, circuit: { referenceV: 400 } });
    const ids = result.risks.map((r) => r.id);
    // 400 V + 12 V from earth at the tip, above 46.7 V peak (IEC 61010-1:2010, 6.3.1)
    expect(result.risks.find((r) => r.id === 'hazardous-live')?.level).toBe('hazard');
    // common practice: a passive probe's ground clip is bonded to protective earth through the scope
    expect(result.risks.find((r) => r.id === 'ground-clip-off-earth')?.level).toBe('hazard');
    expect(ids).toContain('ground-clip-off-earth');
  });

  it('should not call a differential probe on a floating reference a ground-clip hazard', () => {
    const result = diagnose({ probe: { kind: 'differential' }, signal: { expectedAmplitudeV: 12, kind: 'square', frequencyHz: 100e3 }, circuit: { referenceV: 400 } });
    expect(result.risks.map((r) => r.id)).not.toContain('ground-clip-off-earth');
    expect(result.risks.map((r) => r.id)).toContain('hazardous-live');
  });

  it('should read the highest voltage present and the mains connection', () => {
    const result = diagnose({ signal: { expectedAmplitudeV: 3.3, kind: 'dc' }, circuit: { highestVoltageV: 400, mainsConnected: true } });
    expect(result.risks.map((r) => r.id)).toEqual(expect.arrayContaining(['hazardous-live', 'mains-connected']));
  });

  it('should caution from its own lower threshold between the wet-location and normal levels', () => {
    // 30 V peak: above 22.6 V peak (wet) but not 46.7 V peak (normal); IEC 61010-1:2010, 6.3.1
    const result = diagnose({ signal: { expectedAmplitudeV: 30, kind: 'square', frequencyHz: 1e3 } });
    expect(result.risks.find((r) => r.id === 'elevated-voltage')?.level).toBe('caution');
    expect(result.risks.map((r) => r.id)).not.toContain('hazardous-live');
  });

  it('should keep a near-earth reference and a logic level quiet', () => {
    const result = diagnose({ signal: { expectedAmplitudeV: 3.3, kind: 'square', frequencyHz: 1e6 }, circuit: { referenceV: 0.2 } });
    expect(result.risks).toEqual([]);
  });
});
