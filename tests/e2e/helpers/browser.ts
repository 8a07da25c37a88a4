import { existsSync, mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const hasChromium = existsSync(CHROMIUM);
export const SCREENSHOT_DIR = path.resolve(import.meta.dirname, '../../../test-results/screenshots');

/**
 * Locally, a machine without Debian's chromium skips the browser suites with a message;
 * in CI (CI set) a missing browser is a failure, never a silent skip.
 */
export const skipBrowser = !hasChromium && !process.env.CI;
if (skipBrowser) console.warn(`[e2e] skipped: no Chromium at ${CHROMIUM} (apt-get install -y chromium)`);

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
  });
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
