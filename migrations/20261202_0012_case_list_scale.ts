import { sql, type Kysely } from 'kysely';

/**
 * Indexes for the case list at 100,000 cases. The list reads engineers' cases as two disjoint
 * branches (verified ones, their own others), so the verified branch needs `status` first with
 * each sort and filter after it; moderators read every case, so each sort and the cause filter
 * need an index of their own. With them a page and a capped count read index entries only.
 */
const INDEXES: [string, string, string[]][] = [
  ['cases_status_cause_updated', 'cases', ['status', 'cause', 'updated_at']],
  ['cases_cause_updated', 'cases', ['cause', 'updated_at']],
  ['cases_author_status_cause', 'cases', ['author_id', 'status', 'cause', 'updated_at']],
  ['cases_status_created', 'cases', ['status', 'created_at']],
  ['cases_status_title', 'cases', ['status', 'title']],
  ['cases_status_author', 'cases', ['status', 'author_id']],
  ['cases_title', 'cases', ['title']],
  // the tag filter and the tags page count from this index alone
  ['case_tags_tag_case', 'case_tags', ['tag', 'case_id']],
];

export async function up(db: Kysely<unknown>): Promise<void> {
  for (const [name, table, columns] of INDEXES) await db.schema.createIndex(name).on(table).columns(columns).execute();
  // the Lessons page: each cause's latest verified lessons, and how many each cause has
  await db.schema
    .createIndex('cases_lessons')
    .on('cases')
    .columns(['cause', 'verified_at'])
    .where(sql<boolean>`status = 'verified' and lesson_summary is not null and lesson_summary <> ''`)
    .execute();
  // the review desk: oldest submission first
  await db.schema.createIndex('cases_status_submitted').on('cases').columns(['status', 'submitted_at']).execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropIndex('cases_status_submitted').execute();
  await db.schema.dropIndex('cases_lessons').execute();
  for (const [name] of [...INDEXES].reverse()) await db.schema.dropIndex(name).execute();
}
