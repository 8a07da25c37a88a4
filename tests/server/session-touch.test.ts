import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { KyselyPlugin, PluginTransformQueryArgs, PluginTransformResultArgs, QueryResult, RootOperationNode, UnknownRow } from 'kysely';
import type session from 'express-session';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SqliteSessionStore } from '../../server/auth/session-store';
import type { Db } from '../../server/db/database';
import { migrateToLatest } from '../../server/db/migrate';
import { openTestDatabase } from './helpers/test-context';

/** Counts the UPDATE statements the store sends. */
class UpdateCounter implements KyselyPlugin {
  updates = 0;
  transformQuery({ node }: PluginTransformQueryArgs): RootOperationNode {
    if (node.kind === 'UpdateQueryNode') this.updates++;
    return node;
  }
  async transformResult({ result }: PluginTransformResultArgs): Promise<QueryResult<UnknownRow>> {
    return result;
  }
}

const call = <T>(run: (cb: (err?: unknown, value?: T) => void) => void) =>
  new Promise<T | undefined>((resolve, reject) => run((err, value) => (err ? reject(err) : resolve(value))));

const sessionUntil = (expiresMs: number) => ({ cookie: { expires: new Date(expiresMs), originalMaxAge: 7 * 86_400_000 } }) as unknown as session.SessionData;

describe('session expiry on every request (rolling sessions)', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-session-'));
  let opened: { db: Db; drop(): Promise<void> };
  beforeAll(async () => {
    opened = await openTestDatabase(dir);
    await migrateToLatest(opened.db);
  });
  afterAll(async () => {
    await opened.db.destroy();
    await opened.drop();
    rmSync(dir, { recursive: true, force: true });
  });

  it('should send no UPDATE for a request within a minute of the stored expiry, and extend it after', async () => {
    const counter = new UpdateCounter();
    const store = new SqliteSessionStore(opened.db.withPlugin(counter));
    const stored = Date.now() + 7 * 86_400_000;
    await call((cb) => store.set('sid-1', sessionUntil(stored), cb));
    await call((cb) => store.get('sid-1', cb));

    await call((cb) => store.touch('sid-1', sessionUntil(stored + 20_000), cb));
    expect(counter.updates).toBe(0);

    await call((cb) => store.touch('sid-1', sessionUntil(stored + 90_000), cb));
    expect(counter.updates).toBe(1);
    const row = await opened.db.selectFrom('sessions').select('expires_at').where('sid', '=', 'sid-1').executeTakeFirstOrThrow();
    expect(Number(row.expires_at)).toBe(stored + 90_000);

    // a store that has not read the row (another instance) still extends it, once a minute has passed
    const other = new SqliteSessionStore(opened.db);
    await call((cb) => other.touch('sid-1', sessionUntil(stored + 200_000), cb));
    const after = await opened.db.selectFrom('sessions').select('expires_at').where('sid', '=', 'sid-1').executeTakeFirstOrThrow();
    expect(Number(after.expires_at)).toBe(stored + 200_000);
    store.close();
    other.close();
  });
});
