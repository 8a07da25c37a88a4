import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pngBytes, stepCsv } from './helpers/fixtures';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

describe('attachment names keep their UTF-8', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(() => ctx.close());

  it('should store and serve Messung_ü_Ω.png under its own name', async () => {
    const eng = await signedIn(ctx, 'engineer');
    const id = (await eng.post('/api/cases', { title: 'Umlaut file name', summary: 'names' }).expect(201)).body.case.id;
    const shot = (await eng.upload(`/api/cases/${id}/attachments`, await pngBytes(40, 30), 'Messung_ü_Ω.png', 'image/png').expect(201)).body.attachment;
    expect(shot.originalName).toBe('Messung_ü_Ω.png');
    const res = await eng.get(`/api/attachments/${shot.id}/file`).expect(200);
    // source: RFC 8187, 3.2 (percent-encoded UTF-8 in filename*)
    expect(res.headers['content-disposition']).toBe(`inline; filename="Messung____.png"; filename*=UTF-8''Messung_%C3%BC_%CE%A9.png`);
    const capture = (await eng.upload(`/api/cases/${id}/attachments`, stepCsv(50), 'Flanke (µs).csv', 'text/csv').expect(201)).body.attachment;
    expect(capture.originalName).toBe('Flanke (µs).csv');
    const csv = await eng.get(`/api/attachments/${capture.id}/file`).expect(200);
    expect(csv.headers['content-disposition']).toContain(`filename*=UTF-8''Flanke%20%28%C2%B5s%29.csv`);
  });
});
