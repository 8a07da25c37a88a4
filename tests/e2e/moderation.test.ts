import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, screenshot, skipBrowser } from './helpers/browser';
import { startRealServer, type RunningServer } from './helpers/server';

const PASSWORD = 'demo-probe-2026';
const STEP_MS = 90_000;

interface Person {
  context: BrowserContext;
  page: Page;
  /** A JSON call with the session cookie and the CSRF token; the case form UI belongs to another screen. */
  call: (method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE', path: string, data?: unknown) => Promise<{ status: number; body: any }>;
}

async function signedInPerson(browser: Browser, baseUrl: string, email: string, viewport = { width: 1280, height: 900 }): Promise<Person> {
  const context = await browser.newContext({ baseURL: baseUrl, viewport });
  const token = async () => ((await (await context.request.get('/api/auth/csrf')).json()) as { csrfToken: string }).csrfToken;
  const login = await context.request.post('/api/auth/login', { data: { email, password: PASSWORD }, headers: { 'x-csrf-token': await token() } });
  expect(login.status()).toBe(200);
  const csrf = await token();
  const call: Person['call'] = async (method, path, data) => {
    const res = await context.request.fetch(path, { method, data, headers: { 'x-csrf-token': csrf } });
    const text = await res.text();
    return { status: res.status(), body: text ? JSON.parse(text) : null };
  };
  return { context, page: await context.newPage(), call };
}

/** The queue card of one case on the review desk. */
const card = (page: Page, caseId: number) => page.locator(`article[data-case-id="${caseId}"]`);

describe.skipIf(skipBrowser)('moderation in a real browser', () => {
  let server: RunningServer;
  let browser: Browser;
  let eng: Person;
  let mod: Person;
  let admin: Person;
  const ids: Record<'probe' | 'ringing' | 'own' | 'again' | 'spring', number> = { probe: 0, ringing: 0, own: 0, again: 0, spring: 0 };

  const create = async (who: Person, body: Record<string, unknown>) => {
    const res = await who.call('POST', '/api/cases', body);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body.case.id as number;
  };
  const submit = async (who: Person, id: number) => expect((await who.call('POST', `/api/cases/${id}/submit`)).status).toBe(200);

  beforeAll(async () => {
    [server, browser] = await Promise.all([startRealServer(), launchBrowser()]);
    [eng, mod, admin] = await Promise.all([
      signedInPerson(browser, server.baseUrl, 'engineer@falsetrace.test'),
      signedInPerson(browser, server.baseUrl, 'moderator@falsetrace.test'),
      signedInPerson(browser, server.baseUrl, 'admin@falsetrace.test'),
    ]);

    // A 10x probe read with the channel at 1x: shown = true × 1 ÷ 10 (DESIGN.md, attenuation mismatch)
    ids.probe = await create(eng, {
      title: 'Clock rail read 0.33 V instead of 3.3 V',
      summary: 'The 3.3 V clock looked a tenth of its size on channel 2',
      statedCause: 'attenuation-mismatch',
      setup: { probe: { attenuation: 10 }, scope: { attenuationSetting: 1 }, signal: { expectedAmplitudeV: 3.3, frequencyHz: 25e6 }, observed: { amplitudeV: 0.33 } },
      tags: ['10x-at-1x', 'clock'],
    });
    await submit(eng, ids.probe);

    // a mains-side node with a long ground lead, stated as a bandwidth problem: the desk should flag both
    ids.ringing = await create(eng, {
      title: 'Gate drive rang after every edge',
      summary: 'About 150 MHz ringing on the low-side gate of the PFC stage',
      statedCause: 'bandwidth',
      setup: {
        probe: { attenuation: 10, tipCapacitanceF: 10e-12, groundLeadM: 0.15 },
        scope: { attenuationSetting: 10, bandwidthHz: 500e6 },
        circuit: { sourceResistanceOhm: 10, mainsConnected: true, highestVoltageV: 400 },
        signal: { expectedAmplitudeV: 12, riseTimeS: 2e-9 },
        observed: { amplitudeV: 12, ringingFrequencyHz: 150e6, overshootPct: 45 },
      },
      lessonSummary: 'Ringing',
      tags: ['gate-drive'],
    });
    await submit(eng, ids.ringing);

    ids.own = await create(mod, { title: 'My own scope ate the edge', summary: 'A 20 MHz limit left switched on', statedCause: 'bandwidth', lessonSummary: 'Check the bandwidth limit before you measure rise time' });
    await submit(mod, ids.own);

    ids.again = await create(eng, { title: 'Amplitude a tenth of the expected clock', summary: 'Same 1x/10x mix-up on another bench', statedCause: 'attenuation-mismatch', tags: ['x10'] });
    await submit(eng, ids.again);

    // an already verified lesson, so Lessons has more than one group
    ids.spring = await create(eng, {
      title: 'Clip lead rang at 140 MHz',
      summary: '12 cm clip lead on a 1 ns edge',
      statedCause: 'ground-lead',
      lessonSummary: 'Use the ground spring for edges faster than 5 ns',
      lessonDetail: 'A 15 cm clip lead is about 150 nH; with 10 pF at the tip it rings near 130 MHz.',
      tags: ['ground-lead', 'clock'],
    });
    await submit(eng, ids.spring);
    expect((await admin.call('POST', `/api/cases/${ids.spring}/review`, { action: 'verify' })).status).toBe(200);
  });

  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it(
    'should show the queue oldest first with the checklist, filters and own cases locked',
    async () => {
      const { page } = mod;
      await page.goto('/review');
      await page.getByRole('heading', { name: 'Review desk' }).waitFor();
      await card(page, ids.again).waitFor();
      // the demo casebook may have cases waiting too; ours were submitted last, in this order
      const mine = [ids.probe, ids.ringing, ids.own, ids.again];
      const order = await page.locator('article[data-case-id]').evaluateAll((els) => els.map((e) => Number(e.getAttribute('data-case-id'))));
      expect(order.filter((id) => mine.includes(id))).toEqual(mine);
      const queue = (await mod.call('GET', '/api/review/queue')).body.queue as { case: { id: number }; waitingSince: string }[];
      expect(queue.map((e) => e.case.id)).toEqual(order);
      expect(queue.map((e) => e.waitingSince)).toEqual(queue.map((e) => e.waitingSince).sort());

      const probe = card(page, ids.probe);
      await expect(probe.getByRole('link', { name: 'Clock rail read 0.33 V instead of 3.3 V' }).getAttribute('href')).resolves.toBe(`/cases/${ids.probe}`);
      expect(await probe.locator('[data-check="engine_agrees"]').getAttribute('data-state')).toBe('pass');
      expect(await probe.locator('[data-check="lesson"]').getAttribute('data-state')).toBe('attention');
      expect(await probe.locator('[data-check="safety"]').getAttribute('data-state')).toBe('not_needed');
      expect(await probe.locator('header').textContent()).toContain('by Ines Okafor');

      const ringing = card(page, ids.ringing);
      await ringing.getByText('Stated cause disagrees with the engine').waitFor();
      expect(await ringing.locator('[data-check="engine_agrees"]').getAttribute('data-state')).toBe('attention');
      expect(await ringing.locator('[data-check="safety"]').getAttribute('data-state')).toBe('attention');

      const own = card(page, ids.own);
      await own.getByText('another moderator must review this').waitFor();
      await expect(own.getByRole('button', { name: 'Verify' }).isDisabled()).resolves.toBe(true);
      await screenshot(page, 'review-desk');

      await page.getByLabel('Cause').selectOption('bandwidth');
      await page.waitForURL(/cause=bandwidth/);
      await page.locator(`article[data-case-id="${ids.probe}"]`).waitFor({ state: 'detached' });
      await card(page, ids.ringing).waitFor();
      await card(page, ids.own).waitFor();
      const bandwidth = (await mod.call('GET', '/api/review/queue?cause=bandwidth')).body.queue as { case: { id: number; cause: string } }[];
      expect(bandwidth.every((e) => e.case.cause === 'bandwidth')).toBe(true);
      await expect.poll(() => page.locator('article[data-case-id]').count()).toBe(bandwidth.length);
      await page.getByLabel('Cause').selectOption('');
      await page.getByLabel('Only cases that need attention').check();
      await page.waitForURL(/attention=1/);
      await card(page, ids.probe).waitFor();
      await page.getByLabel('Only cases that need attention').uncheck();

      const phone = await mod.context.newPage();
      await phone.setViewportSize({ width: 390, height: 844 });
      await phone.emulateMedia({ colorScheme: 'dark' }); // the phone shot doubles as the dark-theme check
      await phone.goto('/review');
      await card(phone, ids.ringing).waitFor();
      const overflow = await phone.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      expect(overflow).toBeLessThanOrEqual(0);
      await screenshot(phone, 'review-desk-phone');
      await phone.close();
    },
    STEP_MS,
  );

  it(
    'should send a case back with a required note that the author then reads',
    async () => {
      const { page } = mod;
      const probe = card(page, ids.probe);
      await probe.getByRole('button', { name: 'Send back' }).click();
      await probe.getByRole('button', { name: 'Send back' }).last().click();
      await probe.getByText('Say what the author should change').waitFor();
      await probe.getByLabel('What should the author change?').fill('Write the lesson: what should the next engineer check first?');
      await probe.getByRole('button', { name: 'Send back' }).last().click();
      await page.getByText(`Sent back: #${ids.probe}`).waitFor();
      await card(page, ids.probe).waitFor({ state: 'detached' });

      const back = (await eng.call('GET', `/api/cases/${ids.probe}`)).body.case;
      expect(back).toMatchObject({ status: 'needs_changes', reviewNote: 'Write the lesson: what should the next engineer check first?' });
      await eng.page.goto(`/cases/${ids.probe}`);
      await eng.page.getByText('Write the lesson: what should the next engineer check first?').first().waitFor();
      await screenshot(eng.page, 'case-sent-back');

      const patched = await eng.call('PATCH', `/api/cases/${ids.probe}`, {
        lessonSummary: 'Check the channel attenuation setting matches the probe before reading amplitude',
        lessonDetail: 'A 10x probe on a channel set to 1x shows a tenth of the signal; many scopes do not sense the switch position.',
        baseUpdatedAt: back.updatedAt,
      });
      expect(patched.status, JSON.stringify(patched.body)).toBe(200);
      await submit(eng, ids.probe);
    },
    STEP_MS,
  );

  it(
    'should verify the resubmitted case, mark a duplicate and retire another from the desk',
    async () => {
      const { page } = mod;
      const waitingBefore = (await mod.call('GET', '/api/review/count')).body.waiting as number;
      await page.goto('/review');
      const probe = card(page, ids.probe);
      await probe.getByText('Earlier note to the author').waitFor();
      expect(await probe.locator('[data-check="lesson"]').getAttribute('data-state')).toBe('pass');
      await probe.getByRole('button', { name: 'Verify' }).click();
      await probe.getByRole('button', { name: 'Verify case' }).click();
      await page.getByText(`Verified: #${ids.probe}`).waitFor();
      await card(page, ids.probe).waitFor({ state: 'detached' });

      const again = card(page, ids.again);
      await again.getByRole('button', { name: 'Mark duplicate of…' }).click();
      await again.getByRole('button', { name: 'Mark duplicate', exact: true }).click();
      await again.getByText('Name the case this one duplicates').waitFor();
      await again.getByLabel('Original case').fill('clock rail');
      await again.getByRole('radio', { name: /Clock rail read 0\.33 V/ }).check();
      await screenshot(page, 'review-duplicate');
      await again.getByRole('button', { name: 'Mark duplicate', exact: true }).click();
      await page.getByText(`Marked as a duplicate: #${ids.again}`).waitFor();
      await card(page, ids.again).waitFor({ state: 'detached' });

      const ringing = card(page, ids.ringing);
      await ringing.getByRole('button', { name: 'Retire' }).click();
      await ringing.getByLabel('Reason for retiring').fill('The gate driver really was oscillating; not a probing problem.');
      await ringing.getByRole('button', { name: 'Retire case' }).click();
      await card(page, ids.ringing).waitFor({ state: 'detached' });

      const history = (await eng.call('GET', `/api/cases/${ids.probe}/history`)).body.history.map((h: { action: string }) => h.action);
      expect(history).toEqual(['verify', 'submit', 'send_back', 'submit']);
      const dup = (await mod.call('GET', `/api/cases/${ids.again}/history`)).body.history[0];
      expect(dup).toMatchObject({ action: 'duplicate', after: { status: 'retired', duplicateOf: ids.probe } });
      expect((await mod.call('GET', '/api/review/count')).body.waiting).toBe(waitingBefore - 3);
    },
    STEP_MS,
  );

  it(
    'should show the verified lesson on Lessons, let a moderator pin it and print a one-page checklist',
    async () => {
      const { page } = mod;
      await page.goto('/lessons');
      const lesson = page.locator(`li[data-case-id="${ids.probe}"]`);
      await lesson.getByText('Check the channel attenuation setting matches the probe before reading amplitude').waitFor();
      await expect(lesson.getByRole('link', { name: /Clock rail read 0\.33 V/ }).getAttribute('href')).resolves.toBe(`/cases/${ids.probe}`);
      await page.getByRole('heading', { name: /Attenuation setting mismatch/ }).waitFor();
      await page.getByRole('heading', { name: /Ground-lead ringing/ }).waitFor();

      const pinned = page.getByRole('list', { name: 'Pinned lessons' });
      // one pin at a time: two pins in flight together may reach the server in either order
      await lesson.getByRole('button', { name: /Pin to the bench checklist/ }).click();
      await pinned.getByText('Check the channel attenuation setting').waitFor();
      await page.locator(`li[data-case-id="${ids.spring}"]`).getByRole('button', { name: /Pin to the bench checklist/ }).click();
      await pinned.getByText('Use the ground spring for edges faster than 5 ns').waitFor();
      // the spring lesson, pinned last, moves one up: it now comes before the attenuation one
      const pinnedTexts = () => pinned.getByRole('listitem').allTextContents();
      const springFirst = async () => {
        const t = await pinnedTexts();
        return t.findIndex((x) => x.includes('Use the ground spring for edges')) === t.findIndex((x) => x.includes('Check the channel attenuation setting matches')) - 1;
      };
      expect(await springFirst()).toBe(false);
      await pinned.getByRole('button', { name: /^Move up: Use the ground spring/ }).click();
      await expect.poll(springFirst).toBe(true);
      await page.reload();
      await pinned.getByText('Use the ground spring for edges faster than 5 ns').waitFor();
      expect(await springFirst()).toBe(true);
      await page.evaluate(() => window.scrollTo(0, 0)); // the checklist panel is sticky; shoot it in place
      await screenshot(page, 'lessons');

      await page.getByLabel('Search lessons').fill('spring');
      await page.waitForURL(/q=spring/);
      await lesson.waitFor({ state: 'detached' });
      await page.getByLabel('Search lessons').fill('');

      await page.getByRole('link', { name: 'Print checklist' }).click();
      await page.waitForURL(/\/lessons\/checklist$/);
      // the Lessons page's checklist panel has a heading of that name too: wait for the print view's own page heading
      await page.getByRole('heading', { level: 1, name: 'Bench checklist' }).waitFor();
      expect(await page.getByRole('navigation', { name: 'Main' }).count()).toBe(0);
      // pinned last, so they close the list, in the order the moderator set (the heading shows
      // while the lessons still load: wait for a pinned one before reading the list)
      await page.locator('article ol > li', { hasText: 'Check the channel attenuation setting' }).waitFor();
      const items = await page.locator('article ol > li').allTextContents();
      expect(items.at(-2)).toContain('Use the ground spring');
      expect(items.at(-1)).toContain('Check the channel attenuation setting');
      await screenshot(page, 'checklist-print-view');
      await page.emulateMedia({ media: 'print' });
      await screenshot(page, 'checklist-print-media');
      const pdf = (await page.pdf({ format: 'A4' })).toString('latin1');
      expect(pdf.match(/\/Type\s*\/Page(?!s)/g)?.length).toBe(1);
      await page.emulateMedia({ media: 'screen' });

      await eng.page.goto('/lessons');
      await eng.page.locator(`li[data-case-id="${ids.probe}"]`).getByText('Check the channel attenuation setting matches the probe').waitFor();
      const pinButtons = await eng.page.getByRole('button', { name: /Pin to|Unpin/ }).evaluateAll((els) => els.map((e) => e.outerHTML));
      expect(pinButtons, eng.page.url()).toEqual([]);
    },
    STEP_MS,
  );

  it(
    'should show both pins when two pins in flight are answered in the other order',
    async () => {
      const { page } = mod;
      await page.goto('/lessons');
      const pinButtons = page.getByRole('button', { name: /Pin to the bench checklist/ });
      await pinButtons.first().waitFor();
      const [first, second] = await page
        .locator('li[data-case-id]')
        .filter({ has: page.getByRole('button', { name: /Pin to the bench checklist/ }) })
        .evaluateAll((els) => els.slice(0, 2).map((e) => Number(e.getAttribute('data-case-id'))));
      // the first pin's answer (the book with only that pin) is held back until the second's has arrived
      let releaseFirst!: () => void;
      const firstHeld = new Promise<void>((resolve) => (releaseFirst = resolve));
      await page.route(`**/api/lessons/${first}/pin`, async (route) => {
        const response = await route.fetch();
        await firstHeld;
        await route.fulfill({ response });
      });
      const pinned = page.getByRole('list', { name: 'Pinned lessons' });
      const pinnedIds = () => pinned.locator('li[data-pinned-case-id]').evaluateAll((els) => els.map((e) => Number(e.getAttribute('data-pinned-case-id'))));
      const firstAnswered = page.waitForResponse(`**/api/lessons/${first}/pin`);
      await page.locator(`li[data-case-id="${first}"]`).getByRole('button', { name: /Pin to the bench checklist/ }).click();
      await page.locator(`li[data-case-id="${second}"]`).getByRole('button', { name: /Pin to the bench checklist/ }).click();
      await expect.poll(pinnedIds).toContain(second);
      releaseFirst();
      await firstAnswered;
      // the stale answer alone would leave the second pin off the checklist
      await expect.poll(pinnedIds).toEqual(expect.arrayContaining([first, second]));
      await page.unroute(`**/api/lessons/${first}/pin`);
      for (const id of [first, second]) expect((await mod.call('POST', `/api/lessons/${id}/pin`, { pinned: false })).status).toBe(200);
    },
    STEP_MS,
  );

  it(
    'should curate tags from the desk',
    async () => {
      const { page } = mod;
      await page.goto('/review/tags');
      const row = (tag: string) => page.locator(`li[data-tag="${tag}"]`);
      await row('x10').getByRole('button', { name: 'Merge into…' }).click();
      await page.getByRole('dialog').getByLabel('Merge into').selectOption('10x-at-1x');
      await page.getByRole('dialog').getByRole('button', { name: 'Merge' }).click();
      await page.getByText('Merged x10 into 10x-at-1x.').waitFor();
      await row('10x-at-1x').getByText('also matches').waitFor();

      await row('gate-drive').getByRole('button', { name: 'Rename' }).click();
      await page.getByRole('dialog').getByLabel('New name').fill('gate-driver');
      await page.getByRole('dialog').getByRole('button', { name: 'Rename' }).click();
      await row('gate-driver').waitFor();

      await row('clock').getByRole('button', { name: 'Synonyms' }).click();
      const chips = page.getByRole('dialog').getByLabel('Synonyms', { exact: true });
      await chips.fill('clk');
      await chips.press('Enter');
      await page.getByRole('dialog').getByRole('button', { name: 'Save synonyms' }).click();
      await row('clock').getByText('clk').waitFor();

      await row('ground-lead').getByRole('button', { name: 'Retire' }).click();
      await page.getByRole('dialog').getByRole('button', { name: 'Retire tag' }).click();
      await row('ground-lead').getByText('retired').waitFor();
      await screenshot(page, 'review-tags');

      const tags = (await mod.call('GET', '/api/tags')).body.tags as { tag: string; synonyms: string[]; retired: boolean }[];
      expect(tags.find((t) => t.tag === '10x-at-1x')?.synonyms).toContain('x10');
      expect(tags.find((t) => t.tag === 'gate-driver')).toBeTruthy();
      expect(tags.find((t) => t.tag === 'clock')?.synonyms).toContain('clk');
      expect(tags.find((t) => t.tag === 'ground-lead')?.retired).toBe(true);
    },
    STEP_MS,
  );

  it(
    'should keep notification preferences and watched tags on the profile',
    async () => {
      const { page } = eng;
      await page.goto('/profile');
      await page.getByRole('heading', { name: 'E-mail notifications' }).waitFor();
      const commentKind = page.getByRole('group', { name: 'New comment on a case I watch' });
      // the kinds are drawn once the preferences have loaded; only then does an absent one mean anything
      await commentKind.waitFor();
      expect(await page.getByText('A case is submitted for review (moderators)').count()).toBe(0);
      await commentKind.getByText('Daily digest').click();
      await page.getByText('Saved: New comment on a case I watch — daily digest.').waitFor();
      await page.getByLabel('Watch a tag').selectOption('clock');
      await page.getByRole('button', { name: 'Watch', exact: true }).click();
      await page.getByRole('list', { name: 'Watched tags' }).getByText('clock').waitFor();
      await screenshot(page, 'profile-notifications');
      expect((await eng.call('GET', '/api/profile/notifications')).body.prefs.comment).toBe('digest');
      expect((await eng.call('GET', '/api/profile/watches')).body.tags).toContain('clock');
      await page.getByRole('button', { name: 'Stop watching the tag clock' }).click();
      await page.getByRole('button', { name: 'Stop watching the tag clock' }).waitFor({ state: 'detached' });
      expect((await eng.call('GET', '/api/profile/watches')).body.tags).not.toContain('clock');
    },
    STEP_MS,
  );

  it(
    'should have mailed each step, as the Outbox shows',
    async () => {
      const wanted = [
        { to: 'moderator@falsetrace.test', subject: /Clock rail read 0\.33 V.*Submitted for review/ },
        { to: 'engineer@falsetrace.test', subject: /Clock rail read 0\.33 V.*Sent back for changes/ },
        { to: 'moderator@falsetrace.test', subject: /Clock rail read 0\.33 V.*Resubmitted for review/ },
        { to: 'engineer@falsetrace.test', subject: /Clock rail read 0\.33 V.*Verified by/ },
        { to: 'engineer@falsetrace.test', subject: /Amplitude a tenth.*duplicate of #/ },
      ];
      await expect
        .poll(async () => {
          const { messages } = (await admin.call('GET', '/api/dev/outbox')).body as { messages: { to: string; subject: string; text: string }[] };
          return wanted.filter((w) => !messages.some((m) => m.to === w.to && w.subject.test(m.subject))).map((w) => String(w.subject));
        })
        .toEqual([]);
      const { messages } = (await admin.call('GET', '/api/dev/outbox')).body as { messages: { subject: string; text: string }[] };
      expect(messages.find((m) => /Sent back for changes/.test(m.subject))?.text).toContain('Write the lesson: what should the next engineer check first?');

      await admin.page.goto('/dev/outbox');
      await admin.page.getByText(/Clock rail read 0\.33 V instead of 3\.3 V: Verified by/).first().waitFor();
      await screenshot(admin.page, 'outbox-moderation');
    },
    STEP_MS,
  );
});
