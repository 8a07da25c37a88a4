import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';

describe('DATABASE_URL chooses the database', () => {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'falsetrace-config-'));
  afterAll(() => rmSync(dataDir, { recursive: true, force: true }));
  const env = (extra: Record<string, string>) => ({ DATA_DIR: dataDir, SESSION_SECRET: 's', ...extra });

  it('should stay on SQLite in DATA_DIR when unset or empty', () => {
    expect(loadConfig(env({})).databaseUrl).toBeUndefined();
    expect(loadConfig(env({ DATABASE_URL: '  ' })).databaseUrl).toBeUndefined();
  });

  it('should take a PostgreSQL address', () => {
    expect(loadConfig(env({ DATABASE_URL: 'postgres://ft:pw@db.internal:5432/falsetrace' })).databaseUrl).toBe('postgres://ft:pw@db.internal:5432/falsetrace');
    expect(loadConfig(env({ DATABASE_URL: 'postgresql://db.internal/falsetrace' })).databaseUrl).toBe('postgresql://db.internal/falsetrace');
  });

  it('should refuse any other address with a message naming the expected form', () => {
    expect(() => loadConfig(env({ DATABASE_URL: 'mysql://db.internal/falsetrace' }))).toThrow(/PostgreSQL address/);
    expect(() => loadConfig(env({ DATABASE_URL: '/srv/falsetrace.sqlite' }))).toThrow(/leave it unset for SQLite/);
  });
});
