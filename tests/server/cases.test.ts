import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pngBytes, stepCsv } from './helpers/fixtures';
import { createTestContext, invitedEngineer, signedIn, type TestContext, updatedAtOf } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;

describe('case write-ups', () => {
  let ctx: TestContext;
  let author: Client;
  let other: Client;
  let mod: Client;
  const storedFiles = () => readdirSync(path.join(ctx.config.dataDir, 'uploads')).filter((f) => f !== 'incoming');

  beforeAll(async () => {
    ctx = await createTestContext();
    author = await signedIn(ctx, 'engineer');
    mod = await signedIn(ctx, 'moderator');
    // a second engineer to test what a colleague sees
    other = await invitedEngineer(ctx);
  });
  afterAll(() => ctx.close());

  it('should create a draft, edit it with SI setup values, and submit it', async () => {
    const created = await author.post('/api/cases', { title: 'Gate drive read 1.2 V', summary: 'Channel showed a tenth of the 12 V drive' }).expect(201);
    expect(created.body.case).toMatchObject({ status: 'draft', title: 'Gate drive read 1.2 V', permissions: { edit: true, submit: true } });
    const id = created.body.case.id;

    const patched = await author
      .patch(`/api/cases/${id}`, {
        narrative: '## What we saw\n\n| expected | shown |\n|---|---|\n| 12 V | 1.2 V |',
        setup: {
          probe: { nominalAttenuation: 10, attenuation: 10, tipCapacitanceF: 12e-12 },
          scope: { attenuationSetting: 1, inputResistanceOhm: 1e6 },
          signal: { expectedAmplitudeV: 12, kind: 'square', frequencyHz: 100e3 },
          observed: { amplitudeV: 1.2 },
        },
        statedCause: 'attenuation-mismatch',
        tags: ['gate-drive'],
        baseUpdatedAt: created.body.case.updatedAt,
      })
      .expect(200);
    expect(patched.body.case.setup.probe.tipCapacitanceF).toBe(12e-12);
    expect(patched.body.case.tags).toContain('gate-drive');
    expect(patched.body.case.cause).toBe('attenuation-mismatch');

    const stale = await author.patch(`/api/cases/${id}`, { title: 'Other title', baseUpdatedAt: created.body.case.updatedAt }).expect(409);
    expect(stale.body.error).toMatch(/saved elsewhere/);
    // a change that does not say which version it edits could overwrite a newer save unseen
    for (const base of [undefined, '']) {
      const blind = await author.patch(`/api/cases/${id}`, { title: 'Blind overwrite', baseUpdatedAt: base }).expect(409);
      expect(blind.body.error).toMatch(/send baseUpdatedAt/);
    }
    expect((await author.get(`/api/cases/${id}`)).body.case).toMatchObject({ title: 'Gate drive read 1.2 V', updatedAt: patched.body.case.updatedAt });

    expect((await author.post(`/api/cases/${id}/submit`).expect(200)).body.case.status).toBe('in_review');
    const again = await author.patch(`/api/cases/${id}`, { title: 'Sneaky edit' }).expect(403);
    expect(again.body.error).toMatch(/in review cannot be edited/);
  });

  it('should store the new setup fields and the safety note', async () => {
    // an invented bench: a 60 V bus probed differentially, its reference node 48 V from earth
    const setup = {
      probe: { nominalAttenuation: 50, kind: 'differential', cmrrDb: 60 },
      scope: { attenuationSetting: 50, coupling: 'dc', sampleRateHz: 1e9, voltsPerDiv: 10, offsetV: 0, divisions: 8, riseTimeS: 1.2e-9 },
      circuit: { loadResistanceOhm: 1e3, referenceV: 48, highestVoltageV: 60, mainsConnected: false, mainsFrequencyHz: 50 },
      signal: { expectedAmplitudeV: 12, frequencyHz: 100e3, baseV: 0, generatorLoad: 'high-z' },
      observed: { amplitudeV: 12, frequencyHz: 100e3, clipped: false, tiltPct: 0, humFrequencyHz: 50 },
    };
    const safetyNote = 'Differential probe rated for the bus; the scope stays earthed.';
    const created = await author.post('/api/cases', { title: 'Bus ripple with a differential probe', summary: 'Reading a high-side node', setup, safetyNote }).expect(201);
    expect(created.body.case.setup).toMatchObject(setup);
    expect(created.body.case.safetyNote).toBe(safetyNote);
    const id = created.body.case.id;
    const read = (await author.get(`/api/cases/${id}`).expect(200)).body.case;
    expect(read.safetyNote).toBe(safetyNote);
    expect(read.setup.scope.sampleRateHz).toBe(1e9);
    const cleared = await author.patch(`/api/cases/${id}`, { safetyNote: null, baseUpdatedAt: read.updatedAt }).expect(200);
    expect(cleared.body.case.safetyNote).toBeNull();
    expect(cleared.body.case.setup.circuit.referenceV).toBe(48);
    const bad = await author.post('/api/cases', { title: 'Bad fields', summary: 'out of range', setup: { scope: { coupling: 'gnd' }, observed: { tiltPct: 400 } } }).expect(400);
    expect(bad.body.issues.map((i: { path: string }) => i.path)).toEqual(expect.arrayContaining(['setup.scope.coupling', 'setup.observed.tiltPct']));
  });

  it('should refuse bad case input with field paths', async () => {
    const res = await author.post('/api/cases', { title: 'x', summary: '', setup: { probe: { tipCapacitanceF: -1 } } }).expect(400);
    const paths = res.body.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['title', 'summary', 'setup.probe.tipCapacitanceF']));
    await author.get('/api/cases?sort=sideways').expect(400);
    await author.get('/api/cases/abc').expect(400);
  });

  describe('attachments', () => {
    let id: number;
    beforeAll(async () => {
      id = (await author.post('/api/cases', { title: 'Probe ringing on the clock', summary: '25 MHz clock rang at 180 MHz' })).body.case.id;
    });

    it('should accept a real PNG, drop its metadata and make a smaller thumbnail', async () => {
      const png = await pngBytes(1200, 800);
      const res = await author.upload(`/api/cases/${id}/attachments`, png, 'scope.png', 'image/png').expect(201);
      const att = res.body.attachment;
      expect(att).toMatchObject({ kind: 'screenshot', width: 1200, height: 800, contentType: 'image/png' });
      const full = await author.get(att.url).expect(200);
      expect(full.headers['content-type']).toBe('image/png');
      expect(full.headers['x-content-type-options']).toBe('nosniff');
      const thumb = await author.get(att.thumbnailUrl).expect(200);
      expect(thumb.body.length).toBeLessThan(full.body.length);
    });

    it('should accept a CSV capture and store its analysis', async () => {
      const res = await author.upload(`/api/cases/${id}/attachments`, stepCsv(), 'edge.csv', 'text/csv').expect(201);
      expect(res.body.attachment.kind).toBe('capture');
      expect(res.body.attachment.analysis.points).toBe(1000);
      const file = await author.get(res.body.attachment.url).expect(200);
      expect(file.headers['content-type']).toMatch(/^text\/csv/);
      expect(file.headers['content-disposition']).toMatch(/^attachment/);
    });

    it('should refuse a PNG named .csv, an executable named .png, random bytes and an oversize image, storing nothing', async () => {
      const before = storedFiles().length;
      const png = await pngBytes(64, 64);
      const r1 = await author.upload(`/api/cases/${id}/attachments`, png, 'capture.csv', 'text/csv').expect(415);
      expect(r1.body.error).toMatch(/named \.csv but its content is a PNG/);
      const elf = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1]), Buffer.alloc(4000, 7)]);
      const r2 = await author.upload(`/api/cases/${id}/attachments`, elf, 'photo.png', 'image/png').expect(415);
      expect(r2.body.error).toMatch(/Not an accepted screenshot/);
      const noise = Buffer.from(Array.from({ length: 5000 }, (_, i) => (i * 7919) % 256));
      await author.upload(`/api/cases/${id}/attachments`, noise, 'data.csv', 'text/csv').expect(415);
      const huge = Buffer.concat([png.subarray(0, 33), Buffer.alloc(11 * 1024 * 1024, 1)]);
      const r4 = await author.upload(`/api/cases/${id}/attachments`, huge, 'huge.png', 'image/png').expect(413);
      expect(r4.body.error).toMatch(/10 MB/);
      expect(storedFiles().length).toBe(before);
      expect(readdirSync(path.join(ctx.config.dataDir, 'uploads', 'incoming'))).toHaveLength(0);
      const { body } = await author.get(`/api/cases/${id}`);
      expect(body.case.attachments).toHaveLength(2);
    });

    it('should remove an attachment and its files', async () => {
      const { body } = await author.get(`/api/cases/${id}`);
      const shot = body.case.attachments.find((a: { kind: string }) => a.kind === 'screenshot');
      const before = storedFiles().length;
      await author.del(`/api/cases/${id}/attachments/${shot.id}`).expect(204);
      expect(storedFiles().length).toBe(before - 2);
      await author.get(shot.url).expect(404);
    });
  });

  describe('visibility', () => {
    let draftId: number;
    let attUrl: string;
    beforeAll(async () => {
      draftId = (await author.post('/api/cases', { title: 'Private draft of the author', summary: 'not yet for others' })).body.case.id;
      attUrl = (await author.upload(`/api/cases/${draftId}/attachments`, await pngBytes(80, 60), 'a.png', 'image/png')).body.attachment.url;
    });

    it('should let the author and moderators read a draft, and hide it from other engineers and anonymous callers', async () => {
      await author.get(`/api/cases/${draftId}`).expect(200);
      await mod.get(`/api/cases/${draftId}`).expect(200);
      expect((await other.get(`/api/cases/${draftId}`).expect(404)).body.error).toBe('No such case');
      await request(ctx.app).get(`/api/cases/${draftId}`).expect(401);
      expect((await other.get('/api/cases?pageSize=100')).body.cases.map((c: { id: number }) => c.id)).not.toContain(draftId);
    });

    it('should serve attachments only to those who may see the case', async () => {
      await author.get(attUrl).expect(200);
      await mod.get(attUrl).expect(200);
      await other.get(attUrl).expect(404);
      await request(ctx.app).get(attUrl).expect(401);
    });

    it('should let only the author (and moderators) edit', async () => {
      await other.patch(`/api/cases/${draftId}`, { title: 'Taken over' }).expect(404);
      await mod.patch(`/api/cases/${draftId}`, { summary: 'moderator tidied the summary', baseUpdatedAt: await updatedAtOf(mod, draftId) }).expect(200);
      await request(ctx.app).patch(`/api/cases/${draftId}`).send({ title: 'anon' }).expect(403); // no CSRF token at all
      await other.post(`/api/cases/${draftId}/submit`).expect(404);
      await mod.post(`/api/cases/${draftId}/submit`).expect(403);
    });

    it('should let only the author delete a never-submitted draft', async () => {
      const id = (await author.post('/api/cases', { title: 'Throwaway draft', summary: 'will be deleted' })).body.case.id;
      await mod.del(`/api/cases/${id}`).expect(403);
      await author.del(`/api/cases/${id}`).expect(204);
      await author.get(`/api/cases/${id}`).expect(404);
    });
  });

  it('should keep a revision per save after submission and diff any two', async () => {
    const c = (await author.post('/api/cases', { title: 'Slow edges on the SPI clock', summary: 'edges looked 40 ns slow', tags: ['spi'] })).body.case;
    await author.patch(`/api/cases/${c.id}`, { summary: 'draft edits keep no revision', baseUpdatedAt: c.updatedAt }).expect(200);
    await author.post(`/api/cases/${c.id}/submit`).expect(200);
    await mod.patch(`/api/cases/${c.id}`, { summary: 'edges looked 40 ns slow with the 1x probe', setup: { probe: { nominalAttenuation: 1, tipCapacitanceF: 95e-12 } }, baseUpdatedAt: await updatedAtOf(mod, c.id) }).expect(200);
    const { revisions } = (await author.get(`/api/cases/${c.id}/revisions`).expect(200)).body;
    expect(revisions.map((r: { number: number }) => r.number)).toEqual([2, 1]);
    expect(revisions[0].authorName).toBe('Tomasz Lindqvist');
    const { diff } = (await author.get(`/api/cases/${c.id}/revisions/diff?from=1&to=2`).expect(200)).body;
    expect(diff.filter((d: { kind: string }) => d.kind === 'removed').map((d: { text: string }) => d.text).join('')).toContain('Summary: draft edits keep no revision');
    expect(diff.filter((d: { kind: string }) => d.kind === 'added').map((d: { text: string }) => d.text).join('')).toContain('setup.probe.nominalAttenuation: 1');
    expect(diff.map((d: { text: string }) => d.text).join('')).toContain('setup.probe.tipCapacitanceF: 95 pF');
    await author.get(`/api/cases/${c.id}/revisions/diff?from=1&to=9`).expect(404);
  });

  it('should page, sort and filter the case list', async () => {
    const all = (await mod.get('/api/cases?pageSize=2&sort=title').expect(200)).body;
    expect(all.cases).toHaveLength(2);
    expect(all.total).toBeGreaterThan(2);
    expect(all.cases[0].title.localeCompare(all.cases[1].title)).toBeLessThanOrEqual(0);
    const page2 = (await mod.get('/api/cases?pageSize=2&page=2&sort=title')).body;
    expect(page2.cases[0].id).not.toBe(all.cases[0].id);
    const tagged = (await mod.get('/api/cases?tag=gate-drive')).body;
    expect(tagged.cases.map((c: { title: string }) => c.title)).toEqual(['Gate drive read 1.2 V']);
    const inReview = (await mod.get('/api/cases?status=in_review')).body;
    expect(inReview.cases.every((c: { status: string }) => c.status === 'in_review')).toBe(true);
    expect((await mod.get('/api/cases?cause=attenuation-mismatch')).body.total).toBe(1);
    expect((await mod.get('/api/cases?q=SPI')).body.cases[0].title).toMatch(/SPI/);
    // % and _ are text, not wildcards
    await mod.post('/api/cases', { title: 'Output sat at 50% of the rail', summary: 'a percent sign in the title' }).expect(201);
    expect((await mod.get('/api/cases?q=50%25')).body.cases.map((c: { title: string }) => c.title)).toEqual(['Output sat at 50% of the rail']);
    expect((await mod.get('/api/cases?q=%25%25')).body.total).toBe(0);
    expect((await mod.get('/api/cases?q=_')).body.total).toBe(0);
    expect(Object.keys(all.cases[0]).sort()).toEqual(['authorName', 'cause', 'createdAt', 'id', 'status', 'summary', 'tags', 'title', 'updatedAt']);
    expect(existsSync(ctx.config.dataDir)).toBe(true);
  });

  it('should list each case with the same tags, in the same order, as its own page', async () => {
    const c = (await mod.post('/api/cases', { title: 'Tag order on the list', summary: 'three tags out of order', tags: ['zeta-rail', 'adc', 'gate-drive'] }).expect(201)).body.case;
    await mod.post('/api/cases', { title: 'Tag order, no tags', summary: 'none at all' }).expect(201);
    const listed = (await mod.get('/api/cases?q=Tag%20order&pageSize=50').expect(200)).body.cases as { id: number; title: string; tags: string[] }[];
    expect(listed).toHaveLength(2);
    for (const row of listed) expect(row.tags, row.title).toEqual((await mod.get(`/api/cases/${row.id}`).expect(200)).body.case.tags);
    expect(listed.find((r) => r.id === c.id)!.tags).toEqual(expect.arrayContaining(['adc', 'gate-drive', 'zeta-rail']));
    expect(listed.find((r) => r.id !== c.id)!.tags).toEqual([]);
  });

  it('should keep comments: edit own, delete own, moderators hide', async () => {
    const c = (await author.post('/api/cases', { title: 'Comment thread case', summary: 'for comments' })).body.case;
    const mine = (await author.post(`/api/cases/${c.id}/comments`, { body: 'First **thought**' }).expect(201)).body.comment;
    const modsNote = (await mod.post(`/api/cases/${c.id}/comments`, { body: 'Check the ground spring' }).expect(201)).body.comment;
    await author.post(`/api/cases/${c.id}/comments`, { body: '' }).expect(400);
    expect((await author.patch(`/api/comments/${mine.id}`, { body: 'Edited' }).expect(200)).body.comment.body).toBe('Edited');
    await author.patch(`/api/comments/${modsNote.id}`, { body: 'Not mine' }).expect(403);
    await author.del(`/api/comments/${modsNote.id}`).expect(403);
    await author.post(`/api/comments/${mine.id}/hide`, { hidden: true }).expect(403);
    const hidden = (await mod.post(`/api/comments/${mine.id}/hide`, { hidden: true }).expect(200)).body.comment;
    expect(hidden.hidden).toBe(true);
    await author.del(`/api/comments/${modsNote.id}`).expect(403);
    await mod.del(`/api/comments/${modsNote.id}`).expect(204);
    const list = (await author.get(`/api/cases/${c.id}/comments`)).body.comments;
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ hidden: true, permissions: { edit: false, delete: true, hide: false } });
  });
});
