import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { screenshot, signIn, skipBrowser } from './helpers/browser';
import { useRealApp } from './helpers/real-app';

const causes = (page: Page) => page.getByRole('list', { name: 'Causes, most likely first' }).getByRole('article');

describe.skipIf(skipBrowser)('the Diagnose screen in a real browser', () => {
  const app = useRealApp();

  it('should put attenuation mismatch on top for a 10x probe read at 1x, agree with the app.server, and plot a ground lead', async () => {
    const context = await app.browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, app.server.baseUrl, 'engineer@falsetrace.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Diagnose' }).click();
    await page.getByRole('heading', { name: 'Diagnose', level: 1 }).waitFor();

    expect(await page.getByLabel('Probe attenuation').inputValue()).toBe('10x');
    await page.getByLabel('Channel attenuation setting').fill('1x');
    await page.getByLabel('Expected amplitude').fill('3.3 V');
    await page.getByLabel('Observed amplitude').fill('0.33');
    await page.getByRole('button', { name: 'Diagnose', exact: true }).click();
    await page.getByTestId('server-check').getByText(/server recomputed this diagnosis and agrees/).waitFor();

    const top = causes(page).first();
    await top.getByRole('heading', { name: /Attenuation setting mismatch/ }).waitFor();
    const amplitudeRow = top.getByRole('row', { name: /Amplitude/ });
    await expect(amplitudeRow.textContent()).resolves.toMatch(/330 mV.*330 mV/);
    await expect(top.textContent()).resolves.toContain('330 mV instead of 3.30 V');
    expect(page.url()).toContain('scope.attenuationSetting=1');
    const href = await page.getByRole('link', { name: 'Find matching cases' }).getAttribute('href');
    expect(href).toBe('/cases?cause=attenuation-mismatch');
    await screenshot(page, 'diagnose-attenuation');

    await page.getByRole('button', { name: 'Long ground clip on a fast edge' }).click();
    await causes(page).first().getByRole('heading', { name: /Ground-lead ringing/ }).waitFor();
    await causes(page).first().locator('figure canvas').first().waitFor();
    expect(await page.getByLabel('Ground lead length').inputValue()).toBe('15 cm');
    await page.getByRole('button', { name: 'Diagnose', exact: true }).click();
    await page.getByTestId('server-check').getByText(/agrees/).waitFor();
    await screenshot(page, 'diagnose-ground-lead');

    await page.getByLabel('Tip capacitance').fill('12 pq');
    await page.getByLabel('Tip capacitance').blur();
    await page.getByText(/Cannot read this: unknown prefix or unit "pq"/).waitFor();
    await page.getByText(/One value cannot be read and is left out/).waitFor();
    await page.getByRole('button', { name: 'Diagnose', exact: true }).click();
    // a form that cannot be read is not sent; the cursor goes to the field to fix
    await expect(page.evaluate(() => document.activeElement?.getAttribute('name'))).resolves.toBe('probe.tipCapacitanceF');
    await screenshot(page, 'diagnose-bad-input');
    await context.close();
  });

  it('should prefill from a link and fit a phone screen', async () => {
    const context = await app.browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    // signIn waits for the user menu, which a phone-width header folds away
    await signIn(page, app.server.baseUrl, 'engineer@falsetrace.test');
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(`${app.server.baseUrl}/diagnose?probe.attenuation=10&scope.attenuationSetting=1&signal.expectedAmplitudeV=3.3&observed.amplitudeV=0.33`);
    await page.getByRole('heading', { name: 'Diagnose', level: 1 }).waitFor();
    expect(await page.getByLabel('Channel attenuation setting').inputValue()).toBe('1x');
    expect(await page.getByLabel('Observed amplitude').inputValue()).toBe('330 mV');
    await causes(page).first().getByRole('heading', { name: /Attenuation setting mismatch/ }).waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, 'diagnose-phone');

    await page.getByRole('button', { name: 'Long ground clip on a fast edge' }).click();
    await causes(page).first().locator('figure canvas').first().waitFor();
    const wide = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(wide).toBeLessThanOrEqual(0);
    await causes(page).first().scrollIntoViewIfNeeded();
    await screenshot(page, 'diagnose-phone-ground-lead');
    await context.close();
  });
});
