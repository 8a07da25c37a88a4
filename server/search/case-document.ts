import type { CaseSetup, CaseStatus } from '../../shared/schemas/case';
import { CAUSE_LABELS, type Cause } from '../../shared/schemas/diagnosis';
import { caseNumbersOf, type CaseNumbers } from '../../shared/search/case-numbers';
import { formatEngineering } from '../../shared/units/engineering';
import type { SearchSourceRow } from '../db/repositories/search-source';

/** The text fields of a case as the index holds them. */
export interface CaseDoc {
  id: number;
  title: string;
  summary: string;
  /** The cause, tags and their synonyms, and the setup in words. */
  meta: string;
  /** Fix and lesson. */
  remedy: string;
  narrative: string;
}

export const DOC_FIELDS = ['title', 'summary', 'meta', 'remedy', 'narrative'] as const;
export type DocField = (typeof DOC_FIELDS)[number];

/** Field boosts: the words an author chose for the headline outweigh the same words in the story. */
export const FIELD_BOOST: Record<DocField, number> = { title: 4, summary: 3, meta: 2.5, remedy: 1.5, narrative: 1 };

/** What search filters, facets and ranks on without reading the database. */
export interface CaseFacts {
  status: CaseStatus;
  authorId: number;
  cause: string | null;
  engineCause: string | null;
  tags: string[];
  updatedAt: string;
  numbers: CaseNumbers;
}

const parseSetup = (text: string): CaseSetup => {
  try {
    return JSON.parse(text) as CaseSetup;
  } catch {
    return {};
  }
};

const causeWords = (cause: string | null) => (cause ? `${cause} ${CAUSE_LABELS[cause as Cause] ?? ''}` : '');

/** The setup in the words an engineer would search with: "10x probe", "1x channel", "120 MHz". */
function setupWords(s: CaseSetup): string {
  const words: string[] = [];
  const q = (v: number | null | undefined, unit: string, what: string) => {
    if (typeof v === 'number' && Number.isFinite(v)) words.push(`${formatEngineering(v, unit)} ${what}`);
  };
  const p = s.probe ?? {};
  if (p.model) words.push(p.model);
  const ratio = p.attenuation ?? p.nominalAttenuation;
  if (ratio) words.push(`${ratio}x probe`);
  if (p.switchable) words.push('switchable probe');
  if (p.groundKind === 'spring') words.push('ground spring');
  if (p.groundKind === 'clip-lead') words.push('ground lead clip');
  q(p.groundLeadM, 'm', 'ground lead');
  q(p.tipCapacitanceF, 'F', 'tip capacitance');
  q(p.bandwidthHz, 'Hz', 'probe bandwidth');
  const sc = s.scope ?? {};
  if (sc.model) words.push(sc.model);
  if (sc.attenuationSetting) words.push(`channel ${sc.attenuationSetting}x`);
  q(sc.inputResistanceOhm, 'Ω', 'input');
  q(sc.bandwidthHz, 'Hz', 'scope bandwidth');
  if (sc.bandwidthLimitOn) words.push('bandwidth limit');
  const c = s.circuit ?? {};
  if (c.nodeDescription) words.push(c.nodeDescription);
  if (c.mainsConnected) words.push('mains');
  q(c.sourceResistanceOhm, 'Ω', 'source');
  const sig = s.signal ?? {};
  if (sig.kind) words.push(sig.kind === 'square' ? 'square wave' : sig.kind);
  q(sig.frequencyHz, 'Hz', '');
  q(sig.expectedAmplitudeV, 'V', 'expected');
  const o = s.observed ?? {};
  if (o.description) words.push(o.description);
  q(o.amplitudeV, 'V', 'observed');
  q(o.riseTimeS, 's', 'rise time');
  q(o.ringingFrequencyHz, 'Hz', 'ringing');
  if (typeof o.overshootPct === 'number') words.push(`${Number(Math.abs(o.overshootPct).toPrecision(3))} % ${o.overshootPct < 0 ? 'undershoot' : 'overshoot'}`);
  return words.join('. ');
}

/** The index document and the facts of one case. */
export function caseDocument(row: SearchSourceRow, tags: string[], synonyms: Map<string, string[]>): { doc: CaseDoc; facts: CaseFacts } {
  const setup = parseSetup(row.setup);
  const tagWords = tags.flatMap((t) => [t, ...(synonyms.get(t) ?? [])]).join(' ');
  const engine = row.engine_cause && row.engine_cause !== row.cause ? causeWords(row.engine_cause) : '';
  return {
    doc: {
      id: row.id,
      title: row.title,
      summary: row.summary,
      meta: [causeWords(row.cause), row.stated_cause_other ?? '', engine, tagWords, setupWords(setup)].filter(Boolean).join('. '),
      remedy: [row.fix, row.lesson_summary, row.lesson_detail].filter(Boolean).join('\n'),
      narrative: row.narrative,
    },
    facts: {
      status: row.status,
      authorId: row.author_id,
      cause: row.cause,
      engineCause: row.engine_cause,
      tags,
      updatedAt: row.updated_at,
      numbers: caseNumbersOf(setup),
    },
  };
}
