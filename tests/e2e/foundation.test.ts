import { describe, expect, it } from 'vitest';
import { screenshot, signIn, skipBrowser } from './helpers/browser';
import { useRealApp } from './helpers/real-app';

const NAV: Record<string, string[]> = {
  engineer: ['Bench', 'Cases', 'Diagnose', 'Lessons', 'Help'],
  moderator: ['Bench', 'Cases', 'Diagnose', 'Lessons', 'Help', 'Review desk'],
  admin: ['Bench', 'Cases', 'Diagnose', 'Lessons', 'Help', 'Review desk', 'People', 'Outbox'],
};

describe.skipIf(skipBrowser)('foundation in a real browser', () => {
  const app = useRealApp();

  it('should send a signed-out visitor to sign-in and show the form', async () => {
    const page = await app.browser.newPage({ viewport: { width: 1280, height: 800 } });
    await page.goto(`${app.server.baseUrl}/cases`);
    await page.waitForURL(/\/sign-in\?next=%2Fcases/);
    await page.getByRole('heading', { name: 'Sign in to the casebook' }).waitFor();
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('That is not an e-mail address').waitFor();
    await page.getByLabel('E-mail').fill('engineer@falsetrace.test');
    await page.getByLabel('Password', { exact: true }).fill('not-it');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText(/Wrong e-mail or password/).waitFor();
    await screenshot(page, 'sign-in');
    await page.close();
  });

  for (const role of Object.keys(NAV)) {
    it(`should show a ${role} only the navigation the role may use`, async () => {
      const context = await app.browser.newContext({ viewport: { width: 1280, height: 800 } });
      const page = await context.newPage();
      // /api/auth/me answers late: the sign-in answer alone must make the nav whole (the Outbox link once came a moment after the rest)
      await page.route('**/api/auth/me', async (route) => {
        await new Promise((resolve) => setTimeout(resolve, 1500));
        await route.continue();
      });
      await signIn(page, app.server.baseUrl, `${role}@falsetrace.test`);
      expect(await page.getByRole('navigation', { name: 'Main' }).getByRole('link').allTextContents()).toEqual(NAV[role]);
      // a held /api/auth/me may still be in flight: unrouting under it would answer it twice
      await page.unrouteAll({ behavior: 'wait' });
      await page.getByRole('heading', { name: 'What is the trace doing?' }).waitFor();
      await screenshot(page, `bench-${role}`);
      if (role === 'engineer') {
        await page.goto(`${app.server.baseUrl}/admin/people`);
        await page.getByText('Not for your role').waitFor();
      }
      await context.close();
    });
  }

  let attempt = 0;
  it('should let an admin invite a person who then sets a password and signs in', async () => {
    // a retry invites someone new: the first attempt may have left an account or a mail for its invitee
    const invitee = ++attempt === 1 ? 'rafa.quist@falsetrace.test' : `rafa.quist.${attempt}@falsetrace.test`;
    const admin = await (await app.browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
    await signIn(admin, app.server.baseUrl, 'admin@falsetrace.test');
    await admin.getByRole('link', { name: 'People' }).click();
    await admin.getByLabel('E-mail to invite').fill(invitee);
    await admin.getByLabel('Role', { exact: true }).selectOption('moderator');
    await admin.getByRole('button', { name: 'Send invitation' }).click();
    await admin.getByText(`Invitation mailed to ${invitee}`).waitFor();
    await screenshot(admin, 'people');

    await admin.getByRole('link', { name: 'Outbox' }).click();
    // the mail leaves through the background queue; the outbox polls until it arrives
    const mail = admin.getByRole('listitem').filter({ has: admin.getByText(invitee, { exact: true }) });
    await mail.getByText('You are invited to the Falsetrace casebook').waitFor();
    await screenshot(admin, 'outbox');
    const href = await mail.locator('a[href*="/accept-invitation/"]').getAttribute('href');
    expect(href).toMatch(/\/accept-invitation\//);

    const guestContext = await app.browser.newContext({ viewport: { width: 390, height: 844 } });
    const guest = await guestContext.newPage();
    await guest.goto(href!);
    await guest.getByText(invitee).waitFor();
    await guest.getByLabel('Your name').fill('Rafa Quist');
    await guest.getByLabel('New password').fill('ten-to-one-divider');
    await guest.getByLabel('Repeat the password').fill('ten-to-one-divider');
    await guest.getByRole('button', { name: 'Create my account' }).click();
    await guest.getByRole('heading', { name: 'What is the trace doing?' }).waitFor();
    await screenshot(guest, 'bench-phone');
    await guestContext.close();

    const again = await (await app.browser.newContext()).newPage();
    await signIn(again, app.server.baseUrl, invitee, 'ten-to-one-divider');
    expect(await again.getByTestId('user-menu').textContent()).toContain('Rafa Quist');
    await again.goto(href!);
    await again.getByText('This invitation cannot be used').waitFor();
  });

  it('should show a mail that arrives while the Outbox is open, without collapsing the one being read', async () => {
    const reader = await (await app.browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
    await signIn(reader, app.server.baseUrl, 'admin@falsetrace.test');
    await reader.getByRole('link', { name: 'Outbox' }).click();
    const newest = reader.locator('details').first();
    await newest.locator('summary').waitFor();
    expect(await newest.getAttribute('open')).not.toBeNull();
    const readingTo = await newest.locator('summary .font-mono').textContent();

    // another admin, in another browser, invites someone while the reader keeps the Outbox open
    const invitee = `outbox.watch.${Date.now()}@falsetrace.test`;
    const other = await (await app.browser.newContext()).newPage();
    await signIn(other, app.server.baseUrl, 'admin@falsetrace.test');
    await other.getByRole('link', { name: 'People' }).click();
    await other.getByLabel('E-mail to invite').fill(invitee);
    await other.getByRole('button', { name: 'Send invitation' }).click();
    await other.getByText(`Invitation mailed to ${invitee}`).waitFor();

    const arrived = reader.getByRole('listitem').filter({ has: reader.getByText(invitee, { exact: true }) });
    await arrived.waitFor();
    expect(await arrived.locator('details').getAttribute('open')).not.toBeNull();
    const reading = reader.getByRole('listitem').filter({ has: reader.getByText(readingTo!, { exact: true }) });
    expect(await reading.locator('details').getAttribute('open')).not.toBeNull();
    await screenshot(reader, 'outbox-new-mail');
  });
});
