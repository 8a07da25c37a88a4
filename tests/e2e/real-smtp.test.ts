import { describe, expect, it } from 'vitest';
import { screenshot, signIn, skipBrowser } from './helpers/browser';
import { useRealApp } from './helpers/real-app';

// with SMTP_URL set, mails leave for a real server (here a closed port: they stay queued) and the
// Outbox, which shows only the local fake's mails, is neither linked nor served
describe.skipIf(skipBrowser)('an admin on a server with a real SMTP relay', () => {
  const app = useRealApp({ SMTP_URL: 'smtp://127.0.0.1:9?ignoreTLS=true' });

  it('should not be offered the Outbox', async () => {
    const page = await (await app.browser.newContext({ viewport: { width: 1280, height: 800 } })).newPage();
    await signIn(page, app.server.baseUrl, 'admin@falsetrace.test');
    const nav = page.getByRole('navigation', { name: 'Main' });
    await nav.getByRole('link', { name: 'People' }).waitFor();
    await expect.poll(() => page.evaluate(() => fetch('/api/auth/me').then((r) => r.json()).then((b) => b.localMail))).toBe(false);
    await page.goto(`${app.server.baseUrl}/dev/outbox`);
    // shown only once the page's own /api/auth/me has answered, so the nav below is its settled one
    await page.getByText(/no local outbox to show/).waitFor();
    expect(await nav.getByRole('link', { name: 'People' }).count()).toBe(1);
    expect(await nav.getByRole('link').allTextContents()).not.toContain('Outbox');
    await screenshot(page, 'outbox-with-real-smtp');
  });
});
