import { readdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { strToU8, unzipSync, zipSync } from 'fflate';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { UNPACK_LIMITS } from '../../server/casebook/unpack-archive';
import { AppError } from '../../server/errors';
import { importCasebook } from '../../server/services/casebook-import';
import { storagePaths } from '../../server/storage';
import { createTestContext, demoEmail, signedIn, type TestContext } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;
const upload = (c: Client, zip: Uint8Array, query = '') => c.upload(`/api/admin/casebook/import${query}`, Buffer.from(zip), 'casebook.zip', 'application/zip');

/**
 * Rewrites the uncompressed size every central directory entry declares (PKWARE APPNOTE 4.3.12:
 * signature 0x02014b50, uncompressed size at offset 24), as a hand-made bomb would.
 */
function declareSizes(zip: Uint8Array, size: number): Buffer {
  const out = Buffer.from(zip);
  for (let p = out.length - 22; p >= 0; p--) if (out.readUInt32LE(p) === 0x02014b50) out.writeUInt32LE(size, p + 24);
  return out;
}

const leftovers = (ctx: TestContext) => readdirSync(storagePaths(ctx.config).incomingDir);
const caseCount = async (ctx: TestContext) => (await ctx.db.selectFrom('cases').select('id').execute()).length;

describe('casebook archives too big to unpack', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => ctx?.close());

  it('should refuse with 413 an archive whose entries declare more than the limit, before unpacking it', async () => {
    const admin = await signedIn(ctx, 'admin');
    // two small entries, each claiming 400 MB once unpacked: 800 MB in all, over the 640 MB limit
    const bomb = declareSizes(zipSync({ 'casebook.json': strToU8('{}'), 'cases.json': new Uint8Array(4096) }), 400 * 1024 * 1024);
    expect(400 * 2 * 1024 * 1024).toBeGreaterThan(UNPACK_LIMITS.maxBytes);
    for (const query of ['?dryRun=1', '']) {
      const res = await upload(admin, bomb, query).expect(413);
      expect(res.body.error).toBe('This archive is refused: it unpacks to 800 MB, more than the 640 MB allowed. Nothing was unpacked or imported.');
    }
    expect(await caseCount(ctx)).toBe(0);
    expect(leftovers(ctx)).toEqual([]);
  });

  it('should stop unpacking the moment an archive that understates its sizes passes the limit', async () => {
    // declares 1 KB per entry, inflates to 3 MB; the limit here is 1 MB
    const zeros = zipSync({ 'casebook.json': new Uint8Array(3 * 1024 * 1024) });
    expect(unzipSync(zeros)['casebook.json'].length).toBe(3 * 1024 * 1024);
    const file = path.join(ctx.config.dataDir, 'understated.zip');
    writeFileSync(file, declareSizes(zeros, 1024));
    const admin = await ctx.db.selectFrom('users').select(['id', 'name', 'email', 'role']).where('email', '=', demoEmail('admin')).executeTakeFirstOrThrow();
    const refused = await importCasebook(ctx, { ...admin, active: true } as never, file, { dryRun: true, limits: { maxEntries: 10, maxBytes: 1024 * 1024 } }).then(
      () => null,
      (err: unknown) => err,
    );
    expect(refused).toBeInstanceOf(AppError);
    expect((refused as AppError).message).toBe('This archive is refused: it unpacks to more than the 1 MB allowed (its sizes are understated). Nothing was unpacked or imported.');
    expect(leftovers(ctx)).toEqual([]);
  });

  it('should refuse an archive with more files than allowed', async () => {
    const many = Object.fromEntries(Array.from({ length: 12 }, (_, i) => [`f${i}.txt`, strToU8('x')]));
    const file = path.join(ctx.config.dataDir, 'many.zip');
    writeFileSync(file, zipSync(many));
    const err = await importCasebook(ctx, { id: 1 } as never, file, { dryRun: true, limits: { maxEntries: 10, maxBytes: 1024 * 1024 } }).catch((e: unknown) => e);
    expect((err as AppError).message).toMatch(/it holds 12 files, more than the 10 allowed/);
  });

  it('should stream an export from a temporary file it removes afterwards', async () => {
    const admin = await signedIn(ctx, 'admin');
    const res = await admin.agent.get('/api/admin/casebook/export').buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (d: Buffer) => chunks.push(d));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    }).expect(200);
    expect(Number(res.headers['content-length'])).toBe((res.body as Buffer).length);
    expect(Object.keys(unzipSync(res.body as Buffer))).toContain('casebook.json');
    expect(leftovers(ctx)).toEqual([]);
  });
});
