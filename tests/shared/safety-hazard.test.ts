import { describe, expect, it } from 'vitest';
import { HAZARDOUS_LIVE_LIMITS, SAFETY_CAUTIONS, hazardousLive } from '../../shared/safety/hazard';

describe('hazardousLive', () => {
  // source: IEC 61010-1:2010, 6.3.1 (30 V rms, 42.4 V peak, 60 V DC as DESIGN.md gives them)
  it('should use the hazardous-live levels of IEC 61010-1', () => {
    expect(HAZARDOUS_LIVE_LIMITS).toEqual({ acRmsV: 30, peakV: 42.4, dcV: 60 });
  });

  it('should treat a value exactly at a limit as not above it', () => {
    expect(hazardousLive({ highestVoltageV: 30, kind: 'ac-rms' }).hazardous).toBe(false);
    expect(hazardousLive({ highestVoltageV: 42.4, kind: 'peak' }).hazardous).toBe(false);
    expect(hazardousLive({ highestVoltageV: 60, kind: 'dc' }).hazardous).toBe(false);
  });

  it('should flag values just above each limit', () => {
    expect(hazardousLive({ highestVoltageV: 30.1, kind: 'ac-rms' }).hazardous).toBe(true);
    expect(hazardousLive({ highestVoltageV: 42.5, kind: 'peak' }).hazardous).toBe(true);
    expect(hazardousLive({ highestVoltageV: 60.1, kind: 'dc' }).hazardous).toBe(true);
  });

  it('should apply the limit for the kind of voltage given', () => {
    // 48 V DC telecom rail: below 60 V DC, but above 30 V if it were an rms figure
    expect(hazardousLive({ highestVoltageV: 48, kind: 'dc' }).hazardous).toBe(false);
    expect(hazardousLive({ highestVoltageV: 48, kind: 'ac-rms' }).hazardous).toBe(true);
    expect(hazardousLive({ highestVoltageV: -75, kind: 'dc' }).hazardous).toBe(true);
  });

  it('should read a voltage of unknown kind against the strictest (rms) limit', () => {
    expect(hazardousLive({ highestVoltageV: 35 }).hazardous).toBe(true);
    expect(hazardousLive({ highestVoltageV: 24 }).hazardous).toBe(false);
  });

  it('should flag mains-connected equipment whatever the probed voltage', () => {
    const result = hazardousLive({ mainsConnected: true, highestVoltageV: 3.3, kind: 'dc' });
    expect(result.hazardous).toBe(true);
    expect(result.reasons).toEqual(['The equipment is connected to the mains.']);
  });

  it('should give one reason per cause', () => {
    const result = hazardousLive({ mainsConnected: true, highestVoltageV: 325, kind: 'peak' });
    expect(result.reasons).toHaveLength(2);
    expect(result.reasons[1]).toBe('325 V peak is above the 42.4 V peak hazardous-live level.');
  });

  it('should not flag an empty query', () => {
    expect(hazardousLive({})).toEqual({ hazardous: false, reasons: [] });
  });

  it('should cover every point of the safety caution', () => {
    const text = SAFETY_CAUTIONS.join(' ');
    expect(text).toMatch(/protective earth/);
    expect(text).toMatch(/float/);
    expect(text).toMatch(/differential probe|isolated/);
    expect(text).toMatch(/measurement category/);
    expect(text).toMatch(/frequency/);
    expect(text).toMatch(/local electrical codes/);
  });
});
