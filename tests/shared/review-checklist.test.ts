import { describe, expect, it } from 'vitest';
import { reviewChecklist } from '../../shared/review/checklist';
import type { Case } from '../../shared/schemas/case';
import type { DiagnosisResult, Hypothesis, HypothesisCause, Risk } from '../../shared/schemas/diagnosis';

// The checklist reads the engine's result; these results are written by hand to the contract's
// shape (DESIGN.md, HTTP contract), so the rules are tested apart from any engine version.
function hypothesis(causes: HypothesisCause[], fits: boolean, likelihood: number, residual: number): Hypothesis {
  return { cause: causes[0], causes, fits, likelihood, residual, predicted: {}, explanation: '', fix: '', confirm: '' };
}

function diagnosis(verdict: DiagnosisResult['verdict'], hypotheses: Hypothesis[], risks: Risk[] = []): DiagnosisResult {
  return { verdict, hypotheses, tags: [], assumptions: [], risks };
}

function aCase(overrides: Partial<Case>): Case {
  return {
    id: 1,
    title: 'Clock read a tenth of its size',
    summary: 'The 3.3 V clock showed 0.33 V',
    narrative: '',
    status: 'in_review',
    setup: { signal: { expectedAmplitudeV: 3.3 }, observed: { amplitudeV: 0.33 } },
    statedCause: 'attenuation-mismatch',
    statedCauseOther: null,
    cause: 'attenuation-mismatch',
    fix: null,
    lessonSummary: null,
    lessonDetail: null,
    safetyNote: null,
    tags: [],
    diagnosis: null,
    disagreesWithEngine: false,
    attachments: [],
    authorId: 1,
    authorName: 'Ines Okafor',
    reviewNote: null,
    createdAt: '2026-12-01T10:00:00.000Z',
    updatedAt: '2026-12-01T10:00:00.000Z',
    submittedAt: '2026-12-01T10:00:00.000Z',
    permissions: { edit: false, submit: false, comment: true },
    references: [],
    referredBy: [],
    ...overrides,
  };
}

const check = (c: Case, id: string) => reviewChecklist(c).find((i) => i.id === id)!;
const hazard: Risk = { id: 'mains', level: 'hazard', message: 'The ground clip sits on a node away from earth.' };

describe('review checklist: engine agrees', () => {
  it('should pass when the stated cause fits, even when it is not ranked first', () => {
    const d = diagnosis('measurement-error', [hypothesis(['ground-lead'], true, 0.6, 0.1), hypothesis(['attenuation-mismatch'], true, 0.4, 0.2)]);
    const item = check(aCase({ diagnosis: d }), 'engine_agrees');
    expect(item.state).toBe('pass');
    expect(item.detail).toContain('0.20');
  });

  it('should pass when the stated cause is a member of a fitting combined hypothesis', () => {
    const d = diagnosis('measurement-error', [
      hypothesis(['attenuation-mismatch', 'ground-lead'], true, 0.8, 0.05),
      hypothesis(['attenuation-mismatch'], false, 0.2, 1.4),
    ]);
    const item = check(aCase({ statedCause: 'ground-lead', diagnosis: d }), 'engine_agrees');
    expect(item.state).toBe('pass');
    expect(item.detail).toContain('Attenuation setting mismatch + Ground-lead ringing');
  });

  it('should not pass a stated cause ranked first that does not fit', () => {
    const d = diagnosis('unexplained', [hypothesis(['attenuation-mismatch'], false, 0.9, 2.3), hypothesis(['loading'], false, 0.1, 3)]);
    const item = check(aCase({ diagnosis: d }), 'engine_agrees');
    expect(item.state).toBe('attention');
    expect(item.detail).toMatch(/nothing the engine models fits/);
  });

  it('should not pass a probing cause when the verdict says the trace is true', () => {
    const d = diagnosis('faithful', [hypothesis(['faithful'], true, 0.9, 0.01), hypothesis(['attenuation-mismatch'], true, 0.1, 0.3)]);
    const item = check(aCase({ diagnosis: d }), 'engine_agrees');
    expect(item.state).toBe('attention');
    expect(item.detail).toMatch(/trace true/);
  });

  it('should name what fits when the stated cause does not', () => {
    const d = diagnosis('measurement-error', [hypothesis(['bandwidth'], true, 0.7, 0.1), hypothesis(['attenuation-mismatch'], false, 0.3, 1.9)]);
    const item = check(aCase({ diagnosis: d }), 'engine_agrees');
    expect(item.state).toBe('attention');
    expect(item.detail).toContain('Bandwidth too low for the edge');
    expect(item.detail).toContain('1.90');
  });

  it('should ask for the observation when nothing observed is recorded', () => {
    const d = diagnosis('measurement-error', [hypothesis(['attenuation-mismatch'], true, 1, 0)]);
    const item = check(aCase({ setup: { signal: { expectedAmplitudeV: 3.3 } }, diagnosis: d }), 'engine_agrees');
    expect(item.state).toBe('attention');
  });
});

describe('review checklist: safety note', () => {
  const fits = [hypothesis(['attenuation-mismatch'], true, 1, 0)];

  it('should not ask for a note when the engine raises no risk and nothing hazardous is recorded', () => {
    expect(check(aCase({ diagnosis: diagnosis('measurement-error', fits) }), 'safety').state).toBe('not_needed');
  });

  it('should require the Safety note field whenever the engine raises a risk', () => {
    const d = diagnosis('measurement-error', fits, [hazard]);
    const item = check(aCase({ diagnosis: d }), 'safety');
    expect(item.state).toBe('attention');
    expect(item.detail).toContain(hazard.message);
  });

  it('should pass on the Safety note field, not on safety words elsewhere in the write-up', () => {
    const d = diagnosis('measurement-error', fits, [{ id: 'reference', level: 'caution', message: 'The reference node is 48 V from earth.' }]);
    const wordy = aCase({ diagnosis: d, narrative: 'Used a differential probe; isolated, mains safety, hazard, CAT III.' });
    expect(check(wordy, 'safety').state).toBe('attention');
    const noted = aCase({ diagnosis: d, safetyNote: 'Differential probe rated 1000 V CAT II; scope stays earthed.' });
    expect(check(noted, 'safety').state).toBe('pass');
    expect(check(aCase({ diagnosis: d, safetyNote: '   ' }), 'safety').state).toBe('attention');
  });

  it('should still ask for a note on mains-connected equipment when no diagnosis is stored', () => {
    expect(check(aCase({ setup: { circuit: { mainsConnected: true } } }), 'safety').state).toBe('attention');
  });
});

describe('review checklist: safety floor from the recorded setup', () => {
  it('should ask for a note when the reference node sits above our warning level from earth', () => {
    // 60 V peak is above 42.4 V, our own peak warning level (IEC 61010-1:2010 6.3.1 itself says 46.7 V peak)
    expect(check(aCase({ setup: { circuit: { referenceV: 60 }, observed: { amplitudeV: 1 } } }), 'safety').state).toBe('attention');
    expect(check(aCase({ setup: { circuit: { referenceV: 5 }, observed: { amplitudeV: 1 } } }), 'safety').state).toBe('not_needed');
  });
});
