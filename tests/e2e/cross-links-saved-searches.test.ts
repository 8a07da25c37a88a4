import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, screenshot, skipBrowser } from './helpers/browser';
import { startRealServer, type RunningServer } from './helpers/server';

const PASSWORD = 'demo-probe-2026';

interface Person {
  context: BrowserContext;
  page: Page;
  call: (method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE', path: string, data?: unknown) => Promise<{ status: number; body: any }>;
}

async function signedInPerson(browser: Browser, baseUrl: string, email: string): Promise<Person> {
  const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 900 } });
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

describe.skipIf(skipBrowser)('#id links and saved searches in a real browser', () => {
  let server: RunningServer;
  let browser: Browser;
  let eng: Person;
  let mod: Person;
  let admin: Person;
  let verifiedId = 0;
  let privateDraft = 0;
  let newCase = 0;

  beforeAll(async () => {
    [server, browser] = await Promise.all([startRealServer(), launchBrowser()]);
    [eng, mod, admin] = await Promise.all(
      ['engineer@falsetrace.test', 'moderator@falsetrace.test', 'admin@falsetrace.test'].map((e) => signedInPerson(browser, server.baseUrl, e)),
    );
    verifiedId = (await eng.call('GET', '/api/cases?status=verified&pageSize=1')).body.cases[0].id;
    privateDraft = (await admin.call('POST', '/api/cases', { title: 'Admin private draft on the quorn rig', summary: 'Not for engineers yet' })).body.case.id;
  }, 120_000);
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('should mail a saved search when a moderator verifies a matching case', async () => {
    // a retry starts as the first attempt did: without the search an earlier attempt saved
    for (const { id } of (await eng.call('GET', '/api/profile/saved-searches')).body.savedSearches as { id: number }[]) {
      expect((await eng.call('DELETE', `/api/profile/saved-searches/${id}`)).status).toBe(204);
    }
    const page = eng.page;
    await page.goto('/');
    await page.getByRole('searchbox', { name: 'Symptom search' }).fill('zyxquartz ringing ');
    await page.getByTestId('search-total').waitFor();
    await page.getByRole('button', { name: 'Save this search' }).click();
    await page.getByLabel('Name of the saved search').fill('Zyxquartz watch');
    await page.getByLabel('Mail me at once').check();
    await screenshot(page, 'saved-search-form');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.getByRole('status').filter({ hasText: 'Saved as “Zyxquartz watch”' }).waitFor();

    const created = await admin.call('POST', '/api/cases', {
      title: 'Zyxquartz clock ringing on the long lead',
      summary: 'The zyxquartz clock rang at 110 MHz with the clip lead',
      narrative: `Same fault as #${verifiedId}; compare #${privateDraft} on the quorn rig.`,
    });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    newCase = created.body.case.id;
    expect((await admin.call('POST', `/api/cases/${newCase}/submit`)).status).toBe(200);
    expect((await mod.call('POST', `/api/cases/${newCase}/review`, { action: 'verify' })).status).toBe(200);

    // the mail about this case (its link), not one an earlier attempt may have left
    await expect
      .poll(async () => {
        const { messages } = (await admin.call('GET', '/api/dev/outbox')).body as { messages: { to: string; subject: string; text: string }[] };
        return messages.some(
          (m) => m.to === 'engineer@falsetrace.test' && m.subject.includes('Saved search “Zyxquartz watch”') && new RegExp(`Open the case: \\S+/cases/${newCase}(?!\\d)`).test(m.text),
        );
      })
      .toBe(true);
    await admin.page.goto('/dev/outbox');
    await admin.page.getByText(/Saved search “Zyxquartz watch”: Zyxquartz clock ringing/).first().waitFor();
    await screenshot(admin.page, 'saved-search-outbox');
  });

  it('should link #id to a case the reader may open and leave a hidden one as plain text', async () => {
    const page = eng.page;
    await page.goto(`/cases/${newCase}`);
    const narrative = page.locator('section', { has: page.getByRole('heading', { name: 'What happened' }) });
    await narrative.getByText(`#${privateDraft}`).waitFor();
    // the engineer may not open the admin's draft: no link, no title
    expect(await narrative.getByRole('link', { name: `#${privateDraft}` }).count()).toBe(0);
    expect(await page.content()).not.toContain('Admin private draft');
    const link = narrative.getByRole('link', { name: `#${verifiedId}` });
    expect(await link.getAttribute('title')).toBeTruthy();
    await screenshot(page, 'cross-link-case');
    await link.click();
    await page.waitForURL(new RegExp(`/cases/${verifiedId}$`));
    const referredBy = page.locator('section', { has: page.getByRole('heading', { name: 'Referred to by' }) });
    // this case's link: a retried first test leaves another Zyxquartz case pointing here too
    await referredBy.getByRole('link', { name: /Zyxquartz clock ringing/ }).and(page.locator(`[href="/cases/${newCase}"]`)).waitFor();
    await screenshot(page, 'cross-link-referred-by');

    // a moderator may open the draft, so the same text links it for them
    await mod.page.goto(`/cases/${newCase}`);
    await mod.page.getByRole('link', { name: `#${privateDraft}` }).waitFor();
  });

  it('should link #id in the editor preview as the saved page will, and not a case the writer may not open', async () => {
    const page = eng.page;
    await page.goto('/cases/new');
    await page.getByLabel('Narrative', { exact: true }).fill(`Looks like #${verifiedId}, maybe #${privateDraft} too.`);
    const preview = page.getByRole('region', { name: 'Narrative preview' });
    const link = preview.getByRole('link', { name: `#${verifiedId}` });
    await link.waitFor();
    expect(await link.getAttribute('href')).toBe(`/cases/${verifiedId}`);
    await preview.getByText(`#${privateDraft}`).waitFor();
    expect(await preview.getByRole('link', { name: `#${privateDraft}` }).count()).toBe(0);
    await screenshot(page, 'cross-link-editor-preview');
  });

  it('should list the saved search on the profile and remove it', async () => {
    const page = eng.page;
    await page.goto('/profile');
    const list = page.getByRole('list', { name: 'Saved searches' });
    await list.getByText('Zyxquartz watch').waitFor();
    await screenshot(page, 'saved-search-profile');
    await page.getByRole('button', { name: 'Remove the saved search Zyxquartz watch' }).click();
    await page.getByText('No saved searches.').waitFor();
    expect((await eng.call('GET', '/api/profile/saved-searches')).body.savedSearches).toEqual([]);
  });
});
