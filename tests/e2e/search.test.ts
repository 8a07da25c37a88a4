import { describe, expect, it } from 'vitest';
import { screenshot, signIn, skipBrowser } from './helpers/browser';
import { useRealApp } from './helpers/real-app';

// Runs against the demo casebook the server seeds; BenchSearch sits on the Bench at "/",
// SimilarCases on the case page.
describe.skipIf(skipBrowser)('symptom search on the Bench', () => {
  const app = useRealApp();

  it('should search as the engineer types, read the symptom, filter by a facet, and lead to similar cases', async () => {
    const context = await app.browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, app.server.baseUrl, 'engineer@falsetrace.test');
    const box = page.getByRole('search', { name: 'Symptom search' }).getByRole('searchbox');
    await box.pressSequentially('ringing at 110 MHz', { delay: 30 });

    const reading = page.getByTestId('search-reading');
    await expect.poll(() => reading.textContent()).toBe('read as: ringing at 110 MHz → ground-lead ringing');
    const results = page.getByTestId('search-result');
    await results.first().waitFor();
    await expect.poll(() => results.first().locator('mark').count()).toBeGreaterThan(0);
    // marks are elements the client made, from plain text: no markup of a case is rendered
    await expect(results.first().locator('mark').first().innerHTML()).resolves.not.toMatch(/</);
    await expect.poll(() => results.first().getByRole('link').textContent()).toMatch(/110 MHz/);
    await screenshot(page, 'search-ringing');

    const facet = page.getByRole('group', { name: 'Cause' }).getByRole('button', { name: /Ground-lead ringing/ });
    await facet.click();
    await expect.poll(() => facet.getAttribute('aria-pressed')).toBe('true');
    // the results refetch after the facet's button turns pressed: wait for the filtered list
    const causesOnPage = () => results.getByTestId('result-cause').allTextContents();
    await expect
      .poll(async () => {
        const causes = await causesOnPage();
        return causes.length > 0 && causes.every((c) => c === 'Ground-lead ringing');
      })
      .toBe(true);
    await screenshot(page, 'search-facet');

    await page.getByRole('button', { name: 'Amplitude off by a round factor' }).click();
    await expect.poll(() => reading.textContent()).toMatch(/→ attenuation mismatch/);
    await results.first().waitFor();

    await results.first().getByRole('link').click();
    await page.waitForURL(/\/cases\/\d+$/);
    const similar = page.getByTestId('similar-cases');
    await similar.waitFor();
    await expect.poll(() => similar.getByRole('link').count()).toBeGreaterThan(0);
    await screenshot(page, 'search-similar');
    await context.close();
  });

  it('should find an aliasing case by its symptom, offer its cause as a facet, and group its lesson under it', async () => {
    // the demo casebook holds verified aliasing cases (an invented team's PWM read at too low a sample rate)
    const context = await app.browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signIn(page, app.server.baseUrl, 'engineer@falsetrace.test');
    const box = page.getByRole('search', { name: 'Symptom search' }).getByRole('searchbox');
    await box.pressSequentially('sample rate too low', { delay: 30 });
    const facet = page.getByRole('group', { name: 'Cause' }).getByRole('button', { name: /Aliasing/ });
    await facet.waitFor();
    await facet.click();
    await expect.poll(() => facet.getAttribute('aria-pressed')).toBe('true');
    const results = page.getByTestId('search-result');
    await expect
      .poll(async () => {
        const causes = await results.getByTestId('result-cause').allTextContents();
        return causes.length > 0 && causes.every((c) => /Aliasing/.test(c));
      })
      .toBe(true);
    await screenshot(page, 'search-facet-aliasing');
    await page.goto(`${app.server.baseUrl}/lessons`);
    await page.getByRole('heading', { name: /Aliasing: sample rate too low/ }).waitFor();
    await screenshot(page, 'lessons-aliasing');
    await context.close();
  });
});
