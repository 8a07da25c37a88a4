import { Kysely } from 'kysely';

// The extraction as it stands today, copied so this migration never changes with later code:
// `#123` outside fenced and inline code, link targets and URLs, not inside a word or an anchor.
const idsIn = (text: string | null): number[] => {
  if (!text) return [];
  const prose = text
    .replace(/(^|\n)(`{3,}|~{3,})[^\n]*\n[\s\S]*?(\n\2[^\n]*(?=\n|$)|$)/g, '\n')
    .replace(/(`+)[^`]*?\1/g, ' ')
    .replace(/\]\([^)]*\)/g, ']')
    .replace(/<[a-z][a-z0-9+.-]*:[^\s>]*>|\bhttps?:\/\/\S+|\bwww\.\S+/gi, ' ');
  return [...new Set([...prose.matchAll(/(?<![\w&#/])#([1-9]\d{0,8})(?![\w])/g)].map((m) => Number(m[1])))].slice(0, 50);
};

type Row = { source_case_id: number; comment_id: number | null; target_case_id: number };

// Which cases name which as `#123` (in the write-up, or in one comment), so a case page lists the
// cases that link to it with an index lookup rather than a scan of every text.
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('case_references')
    .addColumn('source_case_id', 'integer', (c) => c.notNull().references('cases.id').onDelete('cascade'))
    // null: the case's narrative or lesson; else the comment holding the link
    .addColumn('comment_id', 'integer', (c) => c.references('comments.id').onDelete('cascade'))
    // no foreign key: a text may name a number that is no case (yet); readers join on cases
    .addColumn('target_case_id', 'integer', (c) => c.notNull())
    .execute();
  await db.schema.createIndex('case_references_target').on('case_references').columns(['target_case_id', 'source_case_id']).execute();
  await db.schema.createIndex('case_references_source').on('case_references').columns(['source_case_id', 'comment_id']).execute();

  // the links already written, once; afterwards every save keeps the table in step
  const loose = db as Kysely<any>;
  const rows: Row[] = [];
  for (const c of (await loose.selectFrom('cases').select(['id', 'narrative', 'lesson_detail']).execute()) as { id: number; narrative: string | null; lesson_detail: string | null }[]) {
    for (const t of new Set([...idsIn(c.narrative), ...idsIn(c.lesson_detail)])) if (t !== c.id) rows.push({ source_case_id: c.id, comment_id: null, target_case_id: t });
  }
  for (const c of (await loose.selectFrom('comments').select(['id', 'case_id', 'body']).where('hidden', '=', 0).execute()) as { id: number; case_id: number; body: string }[]) {
    for (const t of idsIn(c.body)) if (t !== c.case_id) rows.push({ source_case_id: c.case_id, comment_id: c.id, target_case_id: t });
  }
  for (let i = 0; i < rows.length; i += 300) await loose.insertInto('case_references').values(rows.slice(i, i + 300)).execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable('case_references').execute();
}
