import { deflateSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { imageWorkers } from '../../server/images/image-pool';
import { pngBytes } from './helpers/fixtures';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

/** CRC-32 of a PNG chunk's type and data. source: ISO/IEC 15948 (PNG), Annex D */
function crc32(bytes: Buffer): number {
  let c = ~0;
  for (const b of bytes) {
    c ^= b;
    for (let k = 0; k < 8; k++) c = c & 1 ? (c >>> 1) ^ 0xedb88320 : c >>> 1;
  }
  return ~c >>> 0;
}

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}

/** A valid 1-bit greyscale PNG of side × side black pixels: tiny on disk, huge once decoded. */
function pngBomb(side: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(side, 0);
  ihdr.writeUInt32BE(side, 4);
  ihdr[8] = 1; // bit depth
  ihdr[9] = 0; // greyscale
  const rowBytes = 1 + Math.ceil(side / 8); // filter byte + packed bits
  const raw = Buffer.alloc(rowBytes * side); // all zero: filter 0, black
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([signature, chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw, { level: 9 })), chunk('IEND', Buffer.alloc(0))]);
}

describe('an image bomb is refused from its header', () => {
  let ctx: TestContext;
  let author: Awaited<ReturnType<typeof signedIn>>;
  let caseId: number;

  beforeAll(async () => {
    ctx = await createTestContext();
    author = await signedIn(ctx, 'engineer');
    caseId = (await author.post('/api/cases', { title: 'Bomb target', summary: 'holds the upload' }).expect(201)).body.case.id;
  });
  afterAll(async () => {
    await imageWorkers.close();
    await ctx.close();
  });

  it('should refuse a 20000 × 20000 PNG with 413 without ever decoding it, while the server keeps answering', async () => {
    const bomb = pngBomb(20_000);
    expect(bomb.length).toBeLessThan(200_000);
    const decode = vi.spyOn(imageWorkers, 'reencode');
    const [upload, health] = await Promise.all([
      author.upload(`/api/cases/${caseId}/attachments`, bomb, 'bomb.png', 'image/png'),
      author.get('/api/health'),
    ]);
    expect(upload.status).toBe(413);
    expect(upload.body.error).toMatch(/too many pixels/);
    expect(health.status).toBe(200);
    expect(decode).not.toHaveBeenCalled();
    decode.mockRestore();
    const listed = (await author.get(`/api/cases/${caseId}`).expect(200)).body.case.attachments;
    expect(listed).toEqual([]);
  });

  it('should still decode an ordinary screenshot, in a worker', async () => {
    const decode = vi.spyOn(imageWorkers, 'reencode');
    const res = await author.upload(`/api/cases/${caseId}/attachments`, await pngBytes(640, 480), 'ok.png', 'image/png').expect(201);
    expect(res.body.attachment).toMatchObject({ width: 640, height: 480 });
    expect(decode).toHaveBeenCalledTimes(1);
    decode.mockRestore();
  });

  it('should refuse a file whose header is cut off as not an image', async () => {
    const cut = pngBomb(100).subarray(0, 20);
    const res = await author.upload(`/api/cases/${caseId}/attachments`, cut, 'cut.png', 'image/png');
    expect([400, 415]).toContain(res.status);
  });
});
