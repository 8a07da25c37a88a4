import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { openDatabase, type Db } from '../../server/db/database';
import { migrateToLatest } from '../../server/db/migrate';
import { seedBenchCasebook, type BenchSeedResult } from '../../server/seed/bench/generate-cases';
import { recomputeDiagnosis } from '../../server/services/case-diagnosis';
import { caseSetupSchema } from '../../shared/schemas/case';
import { openTestDatabase } from './helpers/test-context';

describe('seed:bench generator', () => {
  let db: Db;
  let drop: () => Promise<void>;
  let seeded: BenchSeedResult;
  const dataDir = mkdtempSync(path.join(tmpdir(), 'falsetrace-bench-seed-'));
  beforeAll(async () => {
    // SQLite in memory, or a fresh PostgreSQL database in the api-pg project
    ({ db, drop } = await openTestDatabase(dataDir));
    await migrateToLatest(db);
    seeded = await seedBenchCasebook(db, { count: 600, password: 'pw-for-the-bench', extraPeople: 12 });
  });
  afterAll(async () => {
    await db.destroy();
    await drop();
    rmSync(dataDir, { recursive: true, force: true });
  });

  it('writes every state, several authors, tags and comments', async () => {
    expect(seeded.cases).toBe(600);
    const states = await db.selectFrom('cases').select(['status', (eb) => eb.fn.countAll<number>().as('n')]).groupBy('status').execute();
    expect(states.map((s) => s.status).sort()).toEqual(['draft', 'in_review', 'needs_changes', 'retired', 'verified']);
    const duplicates = await db.selectFrom('cases as d').innerJoin('cases as o', 'o.id', 'd.duplicate_of').select(['d.id', 'o.status', 'd.status as dupStatus']).execute();
    expect(duplicates.length).toBeGreaterThan(0);
    for (const d of duplicates) {
      expect(d.dupStatus).toBe('retired');
      expect(d.status).not.toBe('retired');
    }
    const authors = await db.selectFrom('cases').select('author_id').distinct().execute();
    expect(authors.length).toBeGreaterThan(5);
    expect(seeded.tags).toBeGreaterThan(600);
    expect(seeded.comments).toBeGreaterThan(0);
  });

  it('stores what the case service would: setups pass the schema and the diagnosis is the engine\'s', async () => {
    const rows = await db.selectFrom('cases').select(['id', 'setup', 'stated_cause', 'diagnosis', 'engine_cause', 'cause', 'disagrees']).where('id', 'in', [1, 77, 150, 333, 599]).execute();
    for (const row of rows) {
      const setup = caseSetupSchema.parse(JSON.parse(row.setup));
      const d = recomputeDiagnosis(setup, row.stated_cause as never);
      expect(row.diagnosis).toBe(d.diagnosis ? JSON.stringify(d.diagnosis) : null);
      expect([row.engine_cause, row.cause, row.disagrees]).toEqual([d.engineCause, d.cause, d.disagrees ? 1 : 0]);
    }
  });

  it('leaves the case ids to carry on after the generated ones', async () => {
    const at = new Date().toISOString();
    const author = (await db.selectFrom('users').select('id').limit(1).executeTakeFirstOrThrow()).id;
    const next = await db.insertInto('cases').values({ author_id: author, title: 'Written after the seed', summary: 's', status: 'draft', created_at: at, updated_at: at }).returning('id').executeTakeFirstOrThrow();
    expect(next.id).toBeGreaterThan(600);
    await db.deleteFrom('cases').where('id', '=', next.id).execute();
  });

  it('is deterministic for a seed', async () => {
    const again = openDatabase(':memory:');
    await migrateToLatest(again);
    await seedBenchCasebook(again, { count: 50, password: 'pw-for-the-bench', extraPeople: 12 });
    const a = await db.selectFrom('cases').select(['title', 'narrative', 'status']).where('id', '<=', 50).orderBy('id').execute();
    const b = await again.selectFrom('cases').select(['title', 'narrative', 'status']).orderBy('id').execute();
    await again.destroy();
    expect(b).toEqual(a);
  });
});
