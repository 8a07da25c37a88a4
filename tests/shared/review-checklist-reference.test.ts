import { describe, expect, it } from 'vitest';
import { caseNeedsSafetyNote } from '../../shared/review/checklist';

describe('review checklist safety note', () => {
  it('should ask for a safety note when the reference node is hazardous-live from earth', () => {
    // source: IEC 61010-1:2010 6.3.1 via shared/safety/hazard.ts (peak limit 42.4 V used there)
    expect(caseNeedsSafetyNote({ setup: { circuit: { referenceV: 325 } } })).toBe(true);
    expect(caseNeedsSafetyNote({ setup: { circuit: { referenceV: 12 } } })).toBe(false);
    expect(caseNeedsSafetyNote({ setup: { circuit: { highestVoltageV: 400 } } })).toBe(true);
    expect(caseNeedsSafetyNote({ setup: {} })).toBe(false);
  });
});
