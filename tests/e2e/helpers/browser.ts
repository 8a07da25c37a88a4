import { existsSync, mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const hasChromium = existsSync(CHROMIUM);
export const SCREENSHOT_DIR = path.resolve(import.meta.dirname, '../../../test-results/screenshots');

/**
 * Locally, a machine without Debian's chromium skips the browser suites with a message;
 * in CI (CI set) a missing browser is a failure, never a silent skip.
 */
export const skipBrowser = !hasChromium && !process.env.CI;
if (skipBrowser) console.warn(`[e2e] skipped: no Chromium at ${CHROMIUM} (apt-get install -y chromium)`);

/** Every page still open, with what went wrong in it, so a failed test can show where it stood. */
const openPages = new Map<Page, string[]>();

function watchPage(page: Page) {
  const log: string[] = [];
  openPages.set(page, log);
  page.on('pageerror', (e) => log.push(`page error: ${e.message}`));
  page.on('console', (m) => m.type() === 'error' && log.push(`console: ${m.text()}`));
  page.on('requestfailed', (r) => log.push(`request failed: ${r.method()} ${r.url()} (${r.failure()?.errorText ?? '?'})`));
  page.on('response', (r) => r.status() >= 500 && log.push(`HTTP ${r.status()}: ${r.request().method()} ${r.url()}`));
  page.on('close', () => openPages.delete(page));
}

function watchContext(context: BrowserContext) {
  // a locator that waits in vain fails (naming itself) before the test's own timeout cuts it short
  context.setDefaultTimeout(45_000);
  context.on('page', watchPage);
  return context;
}

export async function launchBrowser(): Promise<Browser> {
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
  });
  const newContext = browser.newContext.bind(browser);
  browser.newContext = async (options) => watchContext(await newContext(options));
  return browser;
}

/** Screenshots every open page and prints its address, its errors and the start of its text. */
export async function reportOpenPages(name: string) {
  let i = 0;
  for (const [page, log] of openPages) {
    const file = `failure-${name}-${++i}`;
    const text = await page
      .locator('body')
      .innerText({ timeout: 2_000 })
      .catch(() => '(no text)');
    await screenshot(page, file).catch(() => undefined);
    console.error([`[e2e] open page ${i}: ${page.url()} (screenshot ${file}.png)`, ...log.slice(-20), `text: ${text.replace(/\s+/g, ' ').slice(0, 600)}`].join('\n  '));
  }
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
}

export async function signIn(page: Page, baseUrl: string, email: string, password = 'demo-probe-2026') {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('user-menu').waitFor();
}
