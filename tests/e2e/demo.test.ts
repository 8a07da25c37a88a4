import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUSES, CAUSE_LABELS } from '../../shared/schemas/diagnosis';
import { launchBrowser, screenshot, signIn, skipBrowser } from './helpers/browser';
import { startRealServer, type RunningServer } from './helpers/server';

const ROLES = ['engineer', 'moderator', 'admin'] as const;

describe.skipIf(skipBrowser)('the demo casebook in a real browser', () => {
  let server: RunningServer;
  let browser: Browser;
  beforeAll(async () => {
    // a fresh DATA_DIR: the server seeds the demo casebook on its first start
    [server, browser] = await Promise.all([startRealServer(), launchBrowser()]);
  }, 120_000);
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  for (const role of ROLES) {
    it(`should show a newcomer signed in as the demo ${role} cases of every cause`, async () => {
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
      const page = await context.newPage();
      await signIn(page, server.baseUrl, `${role}@falsetrace.test`);
      await page.goto(`${server.baseUrl}/cases?pageSize=100`);
      await page.getByRole('status').filter({ hasText: /of \d+ cases/ }).waitFor();
      // the filter's options carry the same labels; only chips in the visible list count
      const list = page.locator('main table');
      for (const cause of CAUSES) {
        await expect(list.getByText(CAUSE_LABELS[cause], { exact: true }).filter({ visible: true }).count(), cause).resolves.toBeGreaterThan(0);
      }
      const summary = await page.getByRole('status').filter({ hasText: /of \d+ cases/ }).textContent();
      const total = Number(summary?.match(/of (\d+) cases/)?.[1]);
      expect(total).toBeGreaterThanOrEqual(role === 'engineer' ? 18 : 30);
      await screenshot(page, `demo-cases-${role}`);
      await context.close();
    });
  }

  it('should open a verified demo case with its screenshot and capture', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, server.baseUrl, 'engineer@falsetrace.test');
    await page.goto(`${server.baseUrl}/cases?q=Buck%20switch%20node`);
    await page.getByRole('link', { name: /Buck switch node rings at 110 MHz/ }).first().click();
    await page.getByRole('heading', { name: /Buck switch node rings at 110 MHz/ }).waitFor();
    await page.locator('img[src*="/api/attachments/"]').first().waitFor();
    await page.waitForLoadState('networkidle');
    await screenshot(page, 'demo-case-buck-ring');
    await context.close();
  });

  it('should render Help with formulas, sources and a pre-filled Diagnose link', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, server.baseUrl, 'engineer@falsetrace.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Help' }).click();
    await page.getByRole('heading', { name: 'Help', exact: true }).waitFor();
    for (const cause of CAUSES) await page.getByRole('link', { name: new RegExp(CAUSE_LABELS[cause]) }).first().waitFor();
    await screenshot(page, 'help-index');

    await page.getByRole('link', { name: /^Bandwidth too low for the edge/ }).first().click();
    // formulas are typeset by KaTeX from their TeX source
    await page.locator('[data-tex^="t_r "] .katex-html').waitFor();
    await page.locator('[data-tex*="{signal}^2 + t_"] .katex-html').waitFor();
    await page.getByText(/IEEE Std 181-2011/).waitFor();
    await screenshot(page, 'help-bandwidth');

    await page.goto(`${server.baseUrl}/help/ground-lead`);
    await page.locator('[data-tex*="sqrt{L C}"] .katex-html').waitFor();
    await page.getByText(/Rosa/).first().waitFor();
    await screenshot(page, 'help-ground-lead');
    await page.getByRole('link', { name: 'Open this example in Diagnose' }).click();
    await page.waitForURL(/\/diagnose\?.*probe\.groundLeadM=0\.15/);
    await page.waitForLoadState('networkidle');
    await screenshot(page, 'help-to-diagnose');

    await page.goto(`${server.baseUrl}/help/safety`);
    await page.locator('[data-tex^="33"] .katex-html').waitFor();
    await page.getByText(/IEC 61010-1/).first().waitFor();
    await screenshot(page, 'help-safety');
    await context.close();
  });

  it('should offer admins the casebook export and import on the People page', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
    const page = await context.newPage();
    await signIn(page, server.baseUrl, 'admin@falsetrace.test');
    await page.goto(`${server.baseUrl}/admin/people`);
    await page.getByRole('heading', { name: 'Export the casebook' }).waitFor();
    await page.getByLabel('Cause').selectOption('ground-lead');
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download the selected cases' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^falsetrace-casebook-\d{4}-\d{2}-\d{2}\.zip$/);
    const file = await download.path();
    await page.getByLabel('Casebook archive (.zip)').setInputFiles(file);
    await page.getByRole('button', { name: 'Check the archive' }).click();
    await page.getByTestId('import-report').waitFor();
    await expect(page.getByTestId('import-report').textContent()).resolves.toMatch(/already here; nothing new to import/);
    await screenshot(page, 'people-casebook-transfer');
    await context.close();
  });
});
