import { describe, expect, it } from 'vitest';
import { IEC_61010_HAZARDOUS_LIVE, hazardousLiveCitation } from '../../shared/safety/iec-61010';

describe('hazardous-live citation', () => {
  // source: IEC 61010-1:2010, 6.3.1 a) normal condition and c) wet locations
  it("should give the standard's levels for normal and wet conditions", () => {
    expect(IEC_61010_HAZARDOUS_LIVE.normal).toEqual({ acRmsV: 33, peakV: 46.7, dcV: 70 });
    expect(IEC_61010_HAZARDOUS_LIVE.wet).toEqual({ acRmsV: 16, peakV: 22.6, dcV: 35 });
    const text = hazardousLiveCitation({ acRmsV: 33, peakV: 46.7, dcV: 70 });
    expect(text).toContain('33 V rms, 46.7 V peak or 70 V DC in normal conditions');
    expect(text).toContain('16 V rms, 22.6 V peak or 35 V DC in wet locations');
    expect(text).not.toMatch(/its own/);
  });

  it('should label a lower warning threshold as ours, never as the standard', () => {
    const text = hazardousLiveCitation({ acRmsV: 30, peakV: 42.4, dcV: 60 });
    expect(text).toMatch(/Falsetrace warns from its own, more cautious levels: 30 V rms, 42.4 V peak or 60 V DC\.$/);
    expect(text.indexOf('30 V rms')).toBeGreaterThan(text.indexOf('Falsetrace'));
  });
});

describe('safety reasons from the recorded setup', () => {
  it('should name mains and a voltage above our level without calling our level the standard', async () => {
    const { setupSafetyReasons } = await import('../../shared/safety/iec-61010');
    expect(setupSafetyReasons({ mainsConnected: true })).toEqual(['The equipment is connected to the mains.']);
    const [reason] = setupSafetyReasons({ highestVoltageV: 325 });
    expect(reason).toMatch(/^325 V is present in the circuit, above the level from which Falsetrace cautions/);
    expect(setupSafetyReasons({ highestVoltageV: 12, mainsConnected: false })).toEqual([]);
    expect(setupSafetyReasons(null)).toEqual([]);
  });
});
