import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, signedIn, type TestContext } from './helpers/test-context';

type Client = Awaited<ReturnType<typeof signedIn>>;

// A two-channel bench export: a preamble saying the channel was set to 1X with millivolt data,
// then CH1 a 1 kHz sine of 1 V peak and CH2 a 10 kHz square 0 → 3.3 V, 2 ms at 1 µs.
function twoChannelCsv(): Buffer {
  const lines = ['Model,Bench scope', 'Vertical Units,mV', 'CH1 Probe,1X', 'CH2 Probe,10X', 'Coupling,DC', 'Sample Interval,1e-6', '', 'Time (s),CH1,CH2'];
  for (let k = 0; k < 2000; k++) {
    const t = k * 1e-6;
    lines.push(`${t.toExponential(6)},${(1000 * Math.sin(2 * Math.PI * 1e3 * t)).toFixed(3)},${Math.floor(t / 50e-6) % 2 ? 3300 : 0}`);
  }
  return Buffer.from(lines.join('\r\n'));
}

describe('POST /api/captures/analyze with channels and settings', () => {
  let ctx: TestContext;
  let eng: Client;
  const upload = (bytes: Buffer, channel?: string) => {
    const req = eng.agent.post('/api/captures/analyze').set('x-csrf-token', eng.token);
    if (channel !== undefined) req.field('channel', channel);
    return req.attach('file', bytes, { filename: 'two.csv', contentType: 'text/csv' });
  };
  beforeAll(async () => {
    ctx = await createTestContext();
    eng = await signedIn(ctx, 'engineer');
  });
  afterAll(() => ctx.close());

  it('lists both channels, analyses the first by default and says so', async () => {
    const { body } = await upload(twoChannelCsv()).expect(200);
    expect(body.channels).toEqual([
      { index: 1, name: 'CH1', unit: 'mV' },
      { index: 2, name: 'CH2', unit: 'mV' },
    ]);
    expect(body.channel).toBe(1);
    expect(body.shape).toBe('sine');
    expect(body.riseTimeS).toBeNull();
    // source: the sine written into the file, 1 V peak (2 V peak to peak) after the mV unit
    expect(body.amplitudeV).toBeCloseTo(2, 2);
    expect(body.metadata).toMatchObject({ attenuationSetting: 1, coupling: 'dc', sampleRateHz: 1e6 });
    expect(body.metadata.raw).toMatchObject({ Model: 'Bench scope', 'Vertical Units': 'mV' });
    expect(body.notes.join(' ')).toMatch(/read as millivolts from the preamble's 'Vertical Units'/);
  });

  it('analyses the channel chosen by number or name, with its own settings', async () => {
    for (const channel of ['2', 'CH2', 'ch2']) {
      const { body } = await upload(twoChannelCsv(), channel).expect(200);
      expect(body.channel).toBe(2);
      expect(body.shape).toBe('square');
      // source: the square written into the file, 0 to 3300 mV, period 100 µs
      expect(body.amplitudeV).toBeCloseTo(3.3, 6);
      expect(Math.abs(body.periodS / 100e-6 - 1)).toBeLessThan(1e-3);
      expect(body.metadata.attenuationSetting).toBe(10);
      for (const f of ['shape', 'clipped', 'tiltPct', 'cornerPct', 'settleTimeConstantS', 'noiseRmsV', 'humFrequencyHz', 'notes', 'metadata']) expect(body).toHaveProperty(f);
    }
  });

  it('refuses a channel the file does not have, naming the ones it has', async () => {
    const { body } = await upload(twoChannelCsv(), '3').expect(400);
    expect(body.error).toMatch(/channel 3 does not exist: the file has 2 signal column\(s\): 1 'CH1', 2 'CH2'/);
    expect((await upload(twoChannelCsv(), '0').expect(400)).body.error).toMatch(/channel numbers start at 1/);
  });

  it('answers preamble-like junk with 400s and a message, never 500', async () => {
    const cell = fc.oneof(fc.constantFrom('Time', 'CH1', 'Vertical Units', 'mV', '10X', 'Start', 'Increment', 'Sequence', '', '1e-6', '-0,5', 'x10', '10:1'), fc.double().map(String), fc.string({ maxLength: 8 }));
    await fc.assert(
      fc.asyncProperty(fc.array(fc.array(cell, { minLength: 1, maxLength: 6 }), { maxLength: 30 }), fc.constantFrom(',', ';', '\t'), fc.option(fc.constantFrom('1', '2', 'CH2', 'x')), async (rows, sep, channel) => {
        const res = await upload(Buffer.from(rows.map((r) => r.join(sep)).join('\r\n')), channel ?? undefined);
        expect([200, 400]).toContain(res.status);
        if (res.status === 400) expect(typeof res.body.error).toBe('string');
      }),
      { numRuns: 60, seed: 2026 },
    );
  });
});

describe('stored captures: channel, before/after and traces per channel', () => {
  let ctx: TestContext;
  let author: Client;
  let caseId: number;
  let first: number;
  let second: number;
  beforeAll(async () => {
    ctx = await createTestContext();
    author = await signedIn(ctx, 'engineer');
    caseId = (await author.post('/api/cases', { title: 'Two channels', summary: 'before and after' }).expect(201)).body.case.id;
    first = (await author.upload(`/api/cases/${caseId}/attachments`, twoChannelCsv(), 'before.csv', 'text/csv').expect(201)).body.attachment.id;
    second = (await author.upload(`/api/cases/${caseId}/attachments`, twoChannelCsv(), 'after.csv', 'text/csv').expect(201)).body.attachment.id;
  });
  afterAll(() => ctx.close());

  it('re-analyses a stored capture on another channel', async () => {
    const { body } = await author.patch(`/api/attachments/${first}/capture`, { channel: 2 }).expect(200);
    expect(body.attachment.analysis.channel).toBe(2);
    expect(body.attachment.analysis.shape).toBe('square');
    await author.patch(`/api/attachments/${first}/capture`, { channel: 5 }).expect(400);
    const kept = (await author.get(`/api/cases/${caseId}`).expect(200)).body.case.attachments.find((a: { id: number }) => a.id === first);
    expect(kept.analysis.channel).toBe(2);
  });

  it('keeps one capture per mark, before and after', async () => {
    await author.patch(`/api/attachments/${first}/capture`, { role: 'before' }).expect(200);
    await author.patch(`/api/attachments/${second}/capture`, { role: 'after' }).expect(200);
    await author.patch(`/api/attachments/${second}/capture`, { role: 'before' }).expect(200);
    const atts = (await author.get(`/api/cases/${caseId}`).expect(200)).body.case.attachments as { id: number; captureRole: string | null }[];
    expect(atts.find((a) => a.id === first)!.captureRole).toBeNull();
    expect(atts.find((a) => a.id === second)!.captureRole).toBe('before');
    await author.patch(`/api/attachments/${second}/capture`, { role: 'sideways' }).expect(400);
  });

  it('serves each channel as a trace', async () => {
    const one = (await author.get(`/api/attachments/${first}/trace?columns=100&channel=1`).expect(200)).body;
    const two = (await author.get(`/api/attachments/${first}/trace?columns=100&channel=2`).expect(200)).body;
    expect(one.channelCount).toBe(2);
    expect(two.channel).toBe(2);
    expect(Math.max(...two.volts)).toBeCloseTo(3.3, 6);
    expect(Math.max(...one.volts)).toBeCloseTo(1, 2);
    await author.get(`/api/attachments/${first}/trace?columns=100&channel=3`).expect(400);
  });
});
