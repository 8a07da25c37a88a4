import { describe, expect, it } from 'vitest';
import type { SearchSourceRow } from '../../server/db/repositories/search-source';
import { caseDocument } from '../../server/search/case-document';
import { CaseIndex } from '../../server/search/case-index';
import { rankCases } from '../../server/search/rank';
import { DEMO_CASES } from '../../server/seed/demo/seed-casebook';
import type { CaseSetup } from '../../shared/schemas/case';

interface Written {
  title: string;
  summary: string;
  narrative: string;
  setup?: CaseSetup;
  statedCause?: string;
  fix?: string;
  lessonSummary?: string;
  tags?: string[];
}

/** The demo casebook, every case verified, plus `extra`, indexed in process. */
function demoIndexWith(extra: Written[]) {
  const all: Written[] = [...DEMO_CASES, ...extra];
  const index = new CaseIndex();
  index.addAll(
    all.map((c, i) => {
      const row: SearchSourceRow = {
        id: i + 1,
        author_id: 1,
        status: 'verified',
        title: c.title,
        summary: c.summary,
        narrative: c.narrative,
        setup: JSON.stringify(c.setup ?? {}),
        stated_cause: c.statedCause ?? null,
        stated_cause_other: null,
        cause: c.statedCause && c.statedCause !== 'unknown' ? c.statedCause : null,
        engine_cause: null,
        fix: c.fix ?? null,
        lesson_summary: c.lessonSummary ?? null,
        lesson_detail: null,
        updated_at: '2026-01-01T00:00:00.000Z',
      };
      return caseDocument(row, c.tags ?? [], new Map());
    }),
  );
  return { index, idOf: (title: string) => all.findIndex((c) => c.title === title) + 1 };
}

const rankedTitles = (index: CaseIndex, q: string) =>
  rankCases(index, { id: 99, role: 'moderator' }, { q, page: 1, pageSize: 10 }, new Map()).page.map((r) => r.id);

describe('search relevance', () => {
  const piezo: Written = {
    title: 'Piezo driver 95 MHz hash on every edge',
    summary: 'A burst after each transition of the buzzer stage.',
    narrative: 'Every transition carried a 95 MHz burst. A short spring on the probe tip made it go away.',
  };

  it('should put a case holding a rare word the user typed above cases the symptom reading guesses', () => {
    const { index, idOf } = demoIndexWith([piezo]);
    expect(rankedTitles(index, 'piezo driver ringing on edges').slice(0, 3)).toContain(idOf(piezo.title));
  });

  it('should read a word still being typed as the word it is becoming, not as its rarest completion', () => {
    // "ground lea" is "ground lead" half typed: a case that says "leakage" once must not come before the cases
    // about the ground lead. common practice, no source (a partial word stands for one word)
    const leakage: Written = { title: 'Qwelbox ground return shows leakage at night', summary: 'A ground return with leakage through a damp connector.', narrative: 'Leakage from the damp connector, not the probe.' };
    const { index, idOf } = demoIndexWith([leakage]);
    const top = rankedTitles(index, 'ground lea').slice(0, 3);
    expect(top).not.toContain(idOf(leakage.title));
    const titles = [...DEMO_CASES.map((c) => c.title), leakage.title];
    for (const id of top) expect(titles[id - 1]).toMatch(/lead|ground clip|ground spring/i);
  });

  it('should find a case written in the past tense from a query in the present, and back', () => {
    const rang: Written = { title: 'Zyxomat output rang after the relay closed', summary: 'The zyxomat line rang for a microsecond.', narrative: 'Rang, then settled.' };
    const { index, idOf } = demoIndexWith([rang]);
    expect(rankedTitles(index, 'zyxomat ringing')[0]).toBe(idOf(rang.title));
    expect(rankedTitles(index, 'zyxomat rings')[0]).toBe(idOf(rang.title));
  });

  it('should rank the case that wrote the irregular form the user typed above one with only its base form', () => {
    // the same words but the verb: a case that says "rang" answers "rang" better than one that says "ringing"
    // common practice, no source (an exact match of the typed form outranks a stem-only match)
    const rang: Written = { title: 'Qwelbox half bridge node rang after each edge', summary: 'The qwelbox node rang hard.', narrative: 'It rang at every transition.' };
    const ringing: Written = { title: 'Qwelbox half bridge node ringing after each edge', summary: 'The qwelbox node was ringing hard.', narrative: 'It was ringing at every transition.' };
    const { index, idOf } = demoIndexWith([rang, ringing]);
    const ranked = rankedTitles(index, 'qwelbox node rang after each edge');
    expect(ranked[0]).toBe(idOf(rang.title));
    // the base form still counts: the case that says "ringing" is found by "rang" too, and "ringing" finds both
    expect(ranked).toContain(idOf(ringing.title));
    expect(rankedTitles(index, 'qwelbox node ringing')).toEqual(expect.arrayContaining([idOf(rang.title), idOf(ringing.title)]));
  });
});
