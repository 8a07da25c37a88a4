import { describe, expect, it } from 'vitest';
import type { SearchSourceRow } from '../../server/db/repositories/search-source';
import { caseDocument } from '../../server/search/case-document';
import { caseMatchesSearch } from '../../server/search/match-case';

// invented demo cases; the expectations follow the search's documented rules (AND over words,
// symptom reading by cause, facet filters), not its scores
function entry(over: Partial<SearchSourceRow>, tags: string[] = []) {
  const row: SearchSourceRow = {
    id: 1, author_id: 1, status: 'verified', title: 'A case', summary: 'summary', narrative: '', setup: '{}',
    stated_cause: null, stated_cause_other: null, cause: null, engine_cause: null, fix: null, lesson_summary: null, lesson_detail: null,
    updated_at: '2026-12-01T10:00:00.000Z', ...over,
  };
  return caseDocument(row, tags, new Map());
}

const ringing = entry({ title: 'Clock ringing on a long clip lead', narrative: 'The ground lead made the clock ring at 120 MHz.', cause: 'ground-lead' }, ['clock']);
const groundOnly = entry({ title: 'Ground loop hum', narrative: 'Hum from the ground of the bench supply.', cause: 'mains-pickup' });
const tenth = entry({ title: 'Logger level far too low', summary: 'The logger input looked small', cause: 'attenuation-mismatch' });
const noSyn = new Map<string, string>();

describe('a saved search against one newly verified case', () => {
  it('should match a case holding every word and not one holding only some', () => {
    expect(caseMatchesSearch(ringing, { q: 'clip lead ringing' }, noSyn)).toBe(true);
    expect(caseMatchesSearch(groundOnly, { q: 'clip lead ringing' }, noSyn)).toBe(false);
  });

  it('should match a case of the cause the symptom reading infers, sharing no word with the query', () => {
    expect(caseMatchesSearch(tenth, { q: 'reads a tenth' }, noSyn)).toBe(true);
    expect(caseMatchesSearch(ringing, { q: 'reads a tenth' }, noSyn)).toBe(false);
  });

  it('should apply the facets as filters', () => {
    expect(caseMatchesSearch(ringing, { q: 'ringing', cause: 'ground-lead' }, noSyn)).toBe(true);
    expect(caseMatchesSearch(ringing, { q: 'ringing', cause: 'bandwidth' }, noSyn)).toBe(false);
    expect(caseMatchesSearch(ringing, { q: '', tag: 'clock' }, noSyn)).toBe(true);
    expect(caseMatchesSearch(groundOnly, { q: '', tag: 'clock' }, noSyn)).toBe(false);
  });

  it('should forgive a misspelt word as the search does', () => {
    expect(caseMatchesSearch(ringing, { q: 'ringng' }, noSyn)).toBe(true);
  });
});
