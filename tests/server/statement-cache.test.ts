import { describe, expect, it, vi } from 'vitest';
import { openDatabase, sqliteOf } from '../../server/db/database';
import { migrateToLatest } from '../../server/db/migrate';

describe('prepared statements on SQLite', () => {
  it('should prepare a query once and reuse it, for plain and streamed reads alike', async () => {
    const db = openDatabase(':memory:');
    try {
      await migrateToLatest(db);
      const prepare = vi.spyOn(sqliteOf(db), 'prepare');
      const query = () => db.selectFrom('users').select('id').where('id', '>', 0);
      for (let k = 0; k < 3; k++) await query().execute();
      expect(prepare).toHaveBeenCalledTimes(1);

      const at = new Date().toISOString();
      await db.insertInto('users').values([1, 2, 3].map((k) => ({ email: `u${k}@falsetrace.test`, name: `U${k}`, role: 'engineer' as const, password_hash: null, created_at: at, updated_at: at }))).execute();
      const seen: number[] = [];
      for await (const row of query().stream()) seen.push(row.id);
      expect(seen).toHaveLength(3);
      // the statement a finished stream used is free again
      expect((await query().execute()).length).toBe(3);
      expect(prepare).toHaveBeenCalledTimes(2);
    } finally {
      await db.destroy();
    }
  });
});
