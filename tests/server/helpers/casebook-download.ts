import type { signedIn } from './test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;

/** The casebook archive `GET /api/admin/casebook/export` (with `query`) sends this client, as bytes: a zip. */
export async function downloadCasebook(c: Client, query = ''): Promise<Buffer> {
  const res = await c.agent
    .get(`/api/admin/casebook/export${query}`)
    .buffer(true)
    .parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (d: Buffer) => chunks.push(d));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    })
    .expect(200)
    .expect('Content-Type', 'application/zip');
  return res.body as Buffer;
}
