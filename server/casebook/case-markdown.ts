import { CASE_STATUS_LABELS, type CaseSetup, type CaseStatus } from '../../shared/schemas/case';
import type { ArchivedAttachment, ArchivedCase, ArchivedComment, ArchivedHistory } from '../../shared/schemas/casebook-archive';
import { CAUSE_LABELS, type Cause } from '../../shared/schemas/diagnosis';
import { formatEngineering } from '../../shared/units/engineering';

/** The unit a setup field carries, from the suffix of its name (SI units everywhere). */
const UNIT_SUFFIXES: [RegExp, string][] = [
  [/Ohm$/, 'Ω'],
  [/Hz$/, 'Hz'],
  [/F$/, 'F'],
  [/V$/, 'V'],
  [/S$/, 's'],
  [/M$/, 'm'],
];

function showValue(field: string, value: unknown): string {
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'number') {
    if (field.endsWith('Pct')) return `${value} %`;
    const unit = UNIT_SUFFIXES.find(([re]) => re.test(field))?.[1];
    return unit ? formatEngineering(value, unit) : String(value);
  }
  return String(value).replace(/\|/g, '\\|').replace(/\n/g, ' ');
}

const causeLabel = (cause: string | null, other: string | null | undefined) =>
  cause === 'other' ? `Other: ${other ?? 'unspecified'}` : cause ? (CAUSE_LABELS[cause as Cause] ?? cause) : 'not stated';

export const day = (iso: string | null) => (iso ? iso.slice(0, 10) : '—');

/** Relative link to a file inside the case's folder; spaces and brackets escaped for Markdown. */
const link = (path: string) => path.replace(/[ ()]/g, (c) => encodeURIComponent(c));

export interface CaseMarkdownInput {
  c: ArchivedCase;
  engineCause: string | null;
  authorName: string;
  userName: (id: number | null) => string;
  comments: ArchivedComment[];
  attachments: (ArchivedAttachment & { localPath: string })[];
  history: ArchivedHistory[];
}

/** One case as a Markdown page a person can read without Falsetrace. */
export function caseMarkdown({ c, engineCause, authorName, userName, comments, attachments, history }: CaseMarkdownInput): string {
  const out: string[] = [`# ${c.title}`, ''];
  out.push(`- **Case** #${c.id} · **Status** ${CASE_STATUS_LABELS[c.status as CaseStatus]}${c.duplicateOf ? ` (duplicate of #${c.duplicateOf})` : ''}`);
  out.push(`- **Cause** ${causeLabel(c.statedCause, c.statedCauseOther)} · **Engine's top cause** ${causeLabel(engineCause, null)}`);
  out.push(`- **Author** ${authorName} · **Created** ${day(c.createdAt)} · **Updated** ${day(c.updatedAt)}${c.verifiedAt ? ` · **Verified** ${day(c.verifiedAt)}` : ''}`);
  if (c.tags.length) out.push(`- **Tags** ${c.tags.join(', ')}`);
  out.push('', `> ${c.summary}`, '');

  const rows = Object.entries(c.setup as CaseSetup).flatMap(([group, fields]) =>
    Object.entries(fields ?? {})
      .filter(([, v]) => v !== null && v !== undefined)
      .map(([field, v]) => `| ${group}.${field} | ${showValue(field, v)} |`),
  );
  if (rows.length) out.push('## Setup', '', '| Field | Value |', '|---|---|', ...rows, '');
  if (c.narrative) out.push('## What happened', '', c.narrative, '');
  if (c.fix) out.push('## Root cause and fix', '', c.fix, '');
  if (c.lessonSummary) out.push('## Lesson', '', `**${c.lessonSummary}**`, ...(c.lessonDetail ? ['', c.lessonDetail] : []), '');
  if (c.retiredReason) out.push('## Retired', '', c.retiredReason, '');
  if (c.reviewNote) out.push('## Review note', '', c.reviewNote, '');
  if (attachments.length) {
    out.push('## Attachments', '');
    for (const a of attachments) {
      out.push(a.kind === 'screenshot' ? `![${a.originalName}](${link(a.localPath)})` : `- [${a.originalName}](${link(a.localPath)}) — capture, ${a.sizeBytes} bytes`);
    }
    out.push('');
  }
  const shown = comments.filter((m) => !m.hidden);
  if (shown.length) {
    out.push('## Comments', '');
    for (const m of shown) out.push(`**${userName(m.authorId)}**, ${day(m.createdAt)}:`, '', m.body, '');
  }
  if (history.length) {
    out.push('## History', '');
    for (const h of history) out.push(`- ${day(h.createdAt)} ${h.action.replace(/_/g, ' ')} by ${userName(h.actorId)}${h.note ? `: ${h.note.replace(/\n/g, ' ')}` : ''}`);
    out.push('');
  }
  return out.join('\n');
}
