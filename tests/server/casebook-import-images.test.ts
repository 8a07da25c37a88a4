import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { unzipSync, zipSync } from 'fflate';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { storagePaths } from '../../server/storage';
import { pngBytes } from './helpers/fixtures';
import { pngBomb, withTextChunk } from './helpers/png-builders';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

const sha = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** The archive with its one screenshot's bytes replaced, every checksum and size kept consistent. */
function withScreenshot(zip: Uint8Array, bytes: Buffer): Uint8Array {
  const files = unzipSync(zip);
  const records = JSON.parse(Buffer.from(files['attachments.json']).toString('utf8')) as { kind: string; file: string; sha256: string; sizeBytes: number }[];
  const shot = records.find((r) => r.kind === 'screenshot')!;
  files[shot.file] = new Uint8Array(bytes);
  shot.sha256 = sha(bytes);
  shot.sizeBytes = bytes.length;
  files['attachments.json'] = Buffer.from(JSON.stringify(records));
  const manifest = JSON.parse(Buffer.from(files['casebook.json']).toString('utf8'));
  manifest.files[shot.file] = sha(bytes);
  manifest.files['attachments.json'] = sha(files['attachments.json']);
  files['casebook.json'] = Buffer.from(JSON.stringify(manifest));
  return zipSync(files);
}

describe('casebook import treats screenshots exactly like uploads', () => {
  let source: TestContext;
  let target: TestContext;
  let archive: Uint8Array;

  beforeAll(async () => {
    [source, target] = await Promise.all([createTestContext(), createTestContext()]);
    const eng = await signedIn(source, 'engineer');
    const id = (await eng.post('/api/cases', { title: 'Screenshot to move', summary: 'moves between teams' }).expect(201)).body.case.id;
    await eng.upload(`/api/cases/${id}/attachments`, await pngBytes(120, 80), 'scope.png', 'image/png').expect(201);
    const admin = await signedIn(source, 'admin');
    archive = (await admin.agent.get('/api/admin/casebook/export').buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    })).body as Buffer;
  });
  afterAll(async () => {
    await source.close();
    await target.close();
  });

  const importing = async (zip: Uint8Array) => (await signedIn(target, 'admin')).upload('/api/admin/casebook/import', Buffer.from(zip), 'casebook.zip', 'application/zip');

  it('should refuse an archive whose screenshot is a pixel bomb, importing nothing', async () => {
    const res = await importing(withScreenshot(archive, pngBomb(20_000)));
    expect(res.status).toBe(413);
    expect(res.body.error).toMatch(/megapixels; nothing was imported/);
    expect(await target.db.selectFrom('cases').select('id').where('title', '=', 'Screenshot to move').execute()).toEqual([]);
  });

  it('should drop metadata from an imported screenshot by re-encoding it', async () => {
    const tagged = withTextChunk(await pngBytes(120, 80), 'Comment', 'GPS 52.52N 13.40E');
    expect(tagged.includes(Buffer.from('GPS 52.52N'))).toBe(true);
    await importing(withScreenshot(archive, tagged)).then((r) => expect(r.status).toBe(200));
    const row = await target.db.selectFrom('attachments').selectAll().where('kind', '=', 'screenshot').executeTakeFirstOrThrow();
    const stored = readFileSync(storagePaths(target.config).fileFor(row.storage_name));
    expect(stored.includes(Buffer.from('GPS 52.52N'))).toBe(false);
    expect(row).toMatchObject({ width: 120, height: 80, content_type: 'image/png', size_bytes: stored.length });
  });
});
