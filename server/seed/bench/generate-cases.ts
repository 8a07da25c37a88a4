import { sql, type Insertable } from 'kysely';
import type { CaseCreateInput, CaseSetup, CaseStatus, StatedCause } from '../../../shared/schemas/case';
import type { Cause } from '../../../shared/schemas/diagnosis';
import { hashPassword } from '../../auth/password';
import type { AuditLogTable, CasesTable, CommentsTable, CaseRevisionsTable, CaseTagsTable, Db, WatchesTable } from '../../db/database';
import { isPostgres, refreshPlannerStatistics } from '../../db/dialect';
import { insertMany } from '../../db/repositories/bulk-insert';
import { recomputeDiagnosis, type StoredDiagnosis } from '../../services/case-diagnosis';
import { markDiagnosesCurrent } from '../../services/rediagnose';
import { DEMO_CASES } from '../demo/seed-casebook';
import { mulberry32 } from '../demo/prng';
import { benchPeople } from './people';
import { between, caseText, commentBody, pick, PRODUCTS, type Rand } from './text';

export interface BenchSeedOptions {
  count: number;
  password: string;
  seed?: number;
  /** Generated people besides the demo team. */
  extraPeople?: number;
  onProgress?: (done: number) => void;
}

export interface BenchSeedResult {
  people: number;
  cases: number;
  byStatus: Record<string, number>;
  comments: number;
  tags: number;
}

type Kind = CaseStatus | 'duplicate';
const STATES: [Kind, number][] = [['verified', 0.68], ['draft', 0.08], ['in_review', 0.07], ['needs_changes', 0.05], ['retired', 0.06], ['duplicate', 0.06]];
const kindOf = (r: Rand): Kind => {
  let x = r();
  for (const [k, p] of STATES) if ((x -= p) < 0) return k;
  return 'verified';
};

// each demo setup is a template; its observations are scaled by one of these factors, so the
// engine sees a few hundred distinct benches and gives fitting, borderline and unexplained verdicts
const VARIANTS = [1, 0.9, 1.1, 0.8, 1.25, 0.95, 1.05, 0.7, 1.4, 0.85, 1.15, 0.6];
const TEMPLATES = DEMO_CASES.map((c) => ({ setup: c.setup, statedCause: c.statedCause ?? null, tags: c.tags ?? [] }));

function variantSetup(setup: CaseSetup, factor: number): CaseSetup {
  if (factor === 1 || !setup.observed) return setup;
  const observed = Object.fromEntries(Object.entries(setup.observed).map(([k, v]) => [k, typeof v === 'number' ? v * factor : v]));
  return { ...setup, observed };
}

const DAY = 86_400_000;
const START = Date.UTC(2023, 0, 2, 8);
const END = Date.UTC(2026, 10, 30, 17);
const iso = (ms: number) => new Date(Math.min(ms, END)).toISOString();

/**
 * Fills an empty casebook with `count` generated cases of the invented Quillfen team: every
 * state (draft, in review, sent back, verified, retired, duplicate), dozens of authors, tags,
 * setups the engine diagnoses (stored exactly as the case service stores them: the same
 * `recomputeDiagnosis`, memoised per distinct setup), narratives of varied length, comments,
 * revisions and review entries. Written in batched transactions; deterministic for a seed.
 */
export async function seedBenchCasebook(db: Db, options: BenchSeedOptions): Promise<BenchSeedResult> {
  const r = mulberry32(options.seed ?? 20261202);
  const passwordHash = await hashPassword(options.password);
  const people = benchPeople(r, options.extraPeople ?? 60);
  const joined = iso(START - 30 * DAY);
  await insertMany(db, 'users', people.map((p) => ({ email: p.email, name: p.name, role: p.role, password_hash: passwordHash, created_at: joined, updated_at: joined })));
  const users = await db.selectFrom('users').select(['id', 'role']).orderBy('id').execute();
  const userIds = users.map((u) => u.id);
  const moderators = users.filter((u) => u.role !== 'engineer').map((u) => u.id);
  // a few prolific authors and a long tail, as in any team
  const author = () => userIds[Math.floor(userIds.length * r() ** 2)];

  const memo = new Map<string, StoredDiagnosis & { json: string | null }>();
  const diagnosisFor = (t: number, v: number, setup: CaseSetup, stated: StatedCause | null) => {
    const key = `${t}|${v}|${stated}`;
    let d = memo.get(key);
    if (!d) {
      const fresh = recomputeDiagnosis(setup, stated);
      d = { ...fresh, json: fresh.diagnosis ? JSON.stringify(fresh.diagnosis) : null };
      memo.set(key, d);
    }
    return d;
  };

  const result: BenchSeedResult = { people: people.length, cases: 0, byStatus: {}, comments: 0, tags: 0 };
  const open: number[] = []; // recent cases a duplicate may point at
  const BATCH = 1000;
  for (let first = 1; first <= options.count; first += BATCH) {
    const cases: Insertable<CasesTable>[] = [];
    const tags: Insertable<CaseTagsTable>[] = [];
    const comments: Insertable<CommentsTable>[] = [];
    const revisions: Insertable<CaseRevisionsTable>[] = [];
    const audit: Insertable<AuditLogTable>[] = [];
    const watches: Insertable<WatchesTable>[] = [];
    for (let id = first; id < Math.min(first + BATCH, options.count + 1); id++) {
      const t = Math.floor(r() * TEMPLATES.length);
      const v = Math.floor(r() * VARIANTS.length);
      const template = TEMPLATES[t];
      const setup = variantSetup(template.setup, VARIANTS[v]);
      const kind = id > 50 ? kindOf(r) : 'verified';
      // a draft often has no stated cause yet
      const stated = kind === 'draft' && r() < 0.4 ? null : template.statedCause;
      const d = diagnosisFor(t, v, setup, stated);
      const cause = (stated ?? d.engineCause ?? 'other') as Cause | 'other';
      const productTag = template.tags.find((tag) => PRODUCTS.some((p) => p.tag === tag));
      const product = PRODUCTS.find((p) => p.tag === productTag) ?? pick(r, PRODUCTS);
      const text = caseText(r, cause, product.name);
      const by = author();
      const created = START + ((END - START - 40 * DAY) * (id - 1)) / options.count + r() * DAY;
      const submitted = kind === 'draft' ? null : created + (0.2 + r() * 4) * DAY;
      const reviewed = submitted && kind !== 'in_review' ? submitted + (0.5 + r() * 8) * DAY : null;
      const reviewer = moderators.find((m) => m !== by && r() < 0.5) ?? moderators.find((m) => m !== by)!;
      const status: CaseStatus = kind === 'duplicate' ? 'retired' : kind;
      const duplicateOf = kind === 'duplicate' && open.length ? open[Math.floor(r() * open.length)] : null;
      const updated = reviewed ?? submitted ?? created + r() * 3 * DAY;
      cases.push({
        id, author_id: by, title: text.title, summary: text.summary, narrative: text.narrative, setup: JSON.stringify(setup),
        stated_cause: stated, stated_cause_other: stated === 'other' ? 'Damaged cable at the fixture' : null,
        fix: kind === 'draft' && r() < 0.5 ? null : text.fix, lesson_summary: kind === 'draft' ? null : text.lessonSummary, lesson_detail: text.lessonDetail,
        safety_note: template.tags.includes('safety') || template.tags.includes('mains') ? 'Mains-referenced circuit: use the differential probe and follow local codes and licensed practice.' : null,
        status, diagnosis: d.json, engine_cause: d.engineCause, cause: d.cause, disagrees: d.disagrees ? 1 : 0,
        review_note: kind === 'needs_changes' ? 'Please attach the capture and say which probe was on the channel.' : null,
        duplicate_of: duplicateOf,
        retired_reason: kind === 'retired' ? 'Not a measurement error after all.' : kind === 'duplicate' ? `Duplicate of case #${duplicateOf}` : null,
        created_at: iso(created), updated_at: iso(updated), submitted_at: submitted ? iso(submitted) : null, verified_at: kind === 'verified' ? iso(reviewed!) : null,
      });
      if (kind === 'verified' || kind === 'in_review') open.push(id);
      if (open.length > 500) open.splice(0, 250);
      const authorTags = new Set([product.tag, ...template.tags.filter(() => r() < 0.7)]);
      for (const tag of authorTags) tags.push({ case_id: id, tag, source: 'author' });
      for (const tag of new Set(d.engineTags)) if (!authorTags.has(tag)) tags.push({ case_id: id, tag, source: 'engine' });
      watches.push({ user_id: by, case_id: id, tag: null, created_at: iso(created) });
      if (submitted) {
        const snapshot: CaseCreateInput = { title: text.title, summary: text.summary, narrative: text.narrative, setup, statedCause: stated, fix: text.fix, lessonSummary: text.lessonSummary, tags: [...authorTags] };
        revisions.push({ case_id: id, number: 1, author_id: by, snapshot: JSON.stringify(snapshot), created_at: iso(submitted) });
        audit.push({ case_id: id, actor_id: by, action: 'submit', before: '{"status":"draft"}', after: '{"status":"in_review"}', note: null, created_at: iso(submitted) });
        if (reviewed) {
          const action = { verified: 'verify', needs_changes: 'send_back', retired: 'retire', duplicate: 'duplicate' }[kind as string] ?? 'verify';
          audit.push({ case_id: id, actor_id: reviewer, action, before: '{"status":"in_review"}', after: JSON.stringify({ status, ...(duplicateOf && { duplicateOf }) }), note: null, created_at: iso(reviewed) });
        }
        for (let c = 0, n = between(r, 0, 4) - 1; c < n; c++) {
          const at = submitted + (c + r()) * DAY;
          comments.push({ case_id: id, author_id: r() < 0.3 ? by : pick(r, userIds), body: commentBody(r), created_at: iso(at), updated_at: iso(at) });
        }
      }
      result.byStatus[kind] = (result.byStatus[kind] ?? 0) + 1;
    }
    await db.transaction().execute(async (trx) => {
      await insertMany(trx, 'cases', cases);
      await insertMany(trx, 'case_tags', tags);
      await insertMany(trx, 'watches', watches);
      await insertMany(trx, 'case_revisions', revisions);
      await insertMany(trx, 'audit_log', audit);
      await insertMany(trx, 'comments', comments);
    });
    result.cases += cases.length;
    result.comments += comments.length;
    result.tags += tags.length;
    options.onProgress?.(result.cases);
  }
  // Case ids are written explicitly (duplicates point at earlier ones). SQLite's AUTOINCREMENT
  // carries on after the highest id by itself; a PostgreSQL identity column does not move on
  // explicit ids, so the next case created would collide with case 1 unless it is set here.
  if (isPostgres(db)) await sql`select setval(pg_get_serial_sequence('cases', 'id'), (select max(id) from cases))`.execute(db);
  await pinLessons(db, moderators[0]);
  // every diagnosis was just computed by this engine: no re-diagnosis at the next start
  await markDiagnosesCurrent(db);
  await refreshPlannerStatistics(db);
  return result;
}

/** A dozen pinned lessons, the earliest verified case of each cause. */
async function pinLessons(db: Db, by: number) {
  const firsts = await db.selectFrom('cases').select(['cause', (eb) => eb.fn.min('id').as('id')]).where('status', '=', 'verified').where('cause', 'is not', null).groupBy('cause').execute();
  const at = new Date(END).toISOString();
  const rows = firsts.slice(0, 12).map((f, position) => ({ case_id: Number(f.id), position, pinned_by: by, created_at: at }));
  if (rows.length) await insertMany(db, 'pinned_lessons', rows);
}
