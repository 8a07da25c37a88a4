import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { imageWorkers } from '../../server/images/image-pool';
import { pngBytes } from './helpers/fixtures';
import { pngBomb } from './helpers/png-builders';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

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
