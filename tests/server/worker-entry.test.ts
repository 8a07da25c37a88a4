import { mkdtempSync, readdirSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { removeOldBundles } from '../../server/worker-entry';

const dir = mkdtempSync(path.join(tmpdir(), 'falsetrace-bundles-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('development worker bundles', () => {
  it('removes a worker’s bundles and scratch files unused for a day, and nothing else', () => {
    const twoDaysAgo = new Date(Date.now() - 2 * 24 * 3600 * 1000);
    const make = (name: string, old: boolean) => {
      writeFileSync(path.join(dir, name), '// bundle');
      if (old) utimesSync(path.join(dir, name), twoDaysAgo, twoDaysAgo);
    };
    make('thread-aaaa.mjs', true);
    make('thread-bbbb.mjs', false); // written an hour ago by another checkout, say
    make('thread-cccc.mjs.4242-1700000000000', true); // a crash's scratch file
    make('other-dddd.mjs', true); // another worker's
    make('thread-eeee.mjs', true); // the current one: kept, whatever its time
    removeOldBundles(dir, 'thread', path.join(dir, 'thread-eeee.mjs'));
    expect(readdirSync(dir).sort()).toEqual(['other-dddd.mjs', 'thread-bbbb.mjs', 'thread-eeee.mjs']);
  });
});
