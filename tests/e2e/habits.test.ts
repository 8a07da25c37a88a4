import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import path from 'node:path';
import { SCREENSHOT_DIR, screenshot, signIn, skipBrowser } from './helpers/browser';
import { useRealApp } from './helpers/real-app';

// Runs against the demo casebook the server seeds: shareable search and table addresses,
// keyboard shortcuts, and wheel zoom and downloads on the plots.
describe.skipIf(skipBrowser)('habits: links, keys and plots', () => {
  const app = useRealApp();
  const open = async (options: { colorScheme?: 'light' | 'dark' } = {}) => {
    const context = await app.browser.newContext({ viewport: { width: 1280, height: 900 }, ...options });
    const page = await context.newPage();
    await signIn(page, app.server.baseUrl, 'engineer@falsetrace.test');
    return { context, page };
  };
  const searchBox = (page: Page) => page.getByRole('search', { name: 'Symptom search' }).getByRole('searchbox');
  const resultTitles = (page: Page) => page.getByTestId('search-result').getByRole('link').allTextContents();
  const causeFacet = (page: Page, name: RegExp) => page.getByRole('group', { name: 'Cause' }).getByRole('button', { name });

  it('should put a search in the address: a link in a fresh browser shows the same results, and back steps through searches', async () => {
    const { context, page } = await open();
    const historyBefore = await page.evaluate(() => history.length);
    await searchBox(page).pressSequentially('ringing at 110 MHz', { delay: 30 });
    // the address follows the box after a pause in typing; on a slow machine a pause mid-word
    // writes part of the words first, and a facet pressed then would start a search of its own
    await page.waitForURL((url) => url.searchParams.get('q') === 'ringing at 110 MHz');
    // typing replaces its own entry: one search is not one entry per letter
    expect((await page.evaluate(() => history.length)) - historyBefore).toBeLessThan(4);
    const facet = causeFacet(page, /Ground-lead ringing/);
    await facet.click();
    await page.waitForURL(/cause=ground-lead/);
    await expect.poll(async () => (await page.getByTestId('result-cause').allTextContents()).every((c) => c === 'Ground-lead ringing')).toBe(true);
    const link = page.url();
    const titles = await resultTitles(page);
    expect(titles.length).toBeGreaterThan(0);

    await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: app.server.baseUrl });
    await page.getByRole('button', { name: 'Copy link to this search' }).click();
    await page.getByTestId('copy-link-status').getByText('Link copied').waitFor();
    expect(await page.evaluate(() => navigator.clipboard.readText())).toBe(link);
    await screenshot(page, 'habits-search-link');

    // a colleague opens the link in another browser
    const other = await open();
    await other.page.goto(link);
    await expect.poll(() => searchBox(other.page).inputValue()).toBe('ringing at 110 MHz');
    await expect.poll(() => causeFacet(other.page, /Ground-lead ringing/).getAttribute('aria-pressed')).toBe('true');
    await expect.poll(() => resultTitles(other.page)).toEqual(titles);
    await other.context.close();

    // a symptom chip starts a new search; back returns to the faceted one, back again un-presses the facet
    await page.getByRole('button', { name: 'Amplitude off by a round factor' }).click();
    await expect.poll(() => page.getByTestId('search-reading').textContent()).toMatch(/→ attenuation mismatch/);
    await page.goBack();
    await expect.poll(() => searchBox(page).inputValue()).toBe('ringing at 110 MHz');
    await expect.poll(() => facet.getAttribute('aria-pressed')).toBe('true');
    await expect.poll(() => resultTitles(page)).toEqual(titles);
    await page.goBack();
    await expect.poll(() => facet.getAttribute('aria-pressed')).toBe('false');
    expect(page.url()).not.toContain('cause=');
    await page.goForward();
    await expect.poll(() => facet.getAttribute('aria-pressed')).toBe('true');
    await context.close();
  });

  it('should keep the Cases filters through a reload and step back through them', async () => {
    const { context, page } = await open();
    await page.goto(`${app.server.baseUrl}/cases`);
    await page.getByRole('heading', { name: 'Cases', level: 1 }).waitFor();
    await page.getByLabel('Status').selectOption('verified');
    await page.waitForURL(/status=verified/);
    await page.getByLabel('Cause').selectOption('attenuation-mismatch');
    await page.waitForURL(/cause=attenuation-mismatch/);
    await page.getByRole('button', { name: /^Title/ }).click();
    await page.waitForURL(/sort=title/);
    await page.reload();
    await expect.poll(() => page.getByLabel('Status').inputValue()).toBe('verified');
    await expect.poll(() => page.getByLabel('Cause').inputValue()).toBe('attenuation-mismatch');
    await expect.poll(() => page.getByRole('columnheader', { name: /Title/ }).getAttribute('aria-sort')).toBe('ascending');
    await page.goBack();
    await expect.poll(() => page.url()).not.toContain('sort=title');
    await page.goBack();
    await expect.poll(() => page.getByLabel('Cause').inputValue()).toBe('');
    expect(await page.getByLabel('Status').inputValue()).toBe('verified');
    await screenshot(page, 'habits-cases-filters');
    await context.close();
  });

  it('should walk the Cases table and the search results with j and k and open one with Enter', async () => {
    const { context, page } = await open();
    await page.goto(`${app.server.baseUrl}/cases?status=verified`);
    const rows = page.locator('table tbody tr');
    await rows.first().waitFor();
    await page.keyboard.press('j');
    await page.keyboard.press('j');
    await page.keyboard.press('k');
    await expect.poll(() => rows.first().getAttribute('aria-current')).toBe('true');
    expect(await rows.nth(1).getAttribute('aria-current')).toBeNull();
    await screenshot(page, 'habits-cases-selected');
    const href = await rows.first().getByRole('link').first().getAttribute('href');
    await page.keyboard.press('Enter');
    await page.waitForURL((url) => url.pathname === href);

    await page.goto(`${app.server.baseUrl}/`);
    await searchBox(page).waitFor();
    // `/` puts the cursor in the search box, and letters typed there stay text
    await page.keyboard.press('/');
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('type'))).toBe('search');
    await page.keyboard.type('ringing at 110 MHz', { delay: 30 });
    expect(page.url()).not.toMatch(/\/cases/);
    const results = page.getByTestId('search-result');
    // results of part of the words stay on screen until the whole query's arrive (its reading says which)
    await expect.poll(() => page.getByTestId('search-reading').textContent()).toMatch(/^read as: ringing at 110 MHz →/);
    await results.first().waitFor();
    await searchBox(page).evaluate((el) => (el as HTMLElement).blur());
    await page.keyboard.press('j');
    await page.keyboard.press('j');
    await expect.poll(() => results.nth(1).getAttribute('aria-current')).toBe('true');
    const second = await results.nth(1).getByRole('link').first().getAttribute('href');
    await screenshot(page, 'habits-search-selected');
    await page.keyboard.press('Enter');
    await page.waitForURL((url) => url.pathname === second);

    // g then c goes to Cases; n starts a new case
    await page.keyboard.press('g');
    await page.keyboard.press('c');
    await page.waitForURL(/\/cases$/);
    await page.keyboard.press('n');
    await page.waitForURL(/\/cases\/new$/);
    await context.close();
  });

  it('should list every shortcut on ?, close on Escape, and walk the review desk', async () => {
    for (const colorScheme of ['light', 'dark'] as const) {
      const context = await app.browser.newContext({ viewport: { width: 1280, height: 900 }, colorScheme });
      const page = await context.newPage();
      await signIn(page, app.server.baseUrl, 'moderator@falsetrace.test');
      await page.keyboard.press('?');
      const sheet = page.getByRole('dialog', { name: 'Keyboard shortcuts' });
      await sheet.waitFor();
      for (const action of ['Start a new case', 'Select the next case', 'Open the selected case', 'Open Cases', 'Show this list']) await sheet.getByText(action).first().waitFor();
      await screenshot(page, `habits-shortcuts-${colorScheme}`);
      await page.keyboard.press('Escape');
      await sheet.waitFor({ state: 'detached' });

      await page.goto(`${app.server.baseUrl}/review`);
      const entries = page.getByRole('list', { name: 'Cases waiting for review' }).locator(':scope > li');
      await entries.first().waitFor();
      await page.keyboard.press('j');
      await expect.poll(() => entries.first().getAttribute('aria-current')).toBe('true');
      await screenshot(page, `habits-review-selected-${colorScheme}`);
      const caseHref = await entries.first().getByRole('heading').getByRole('link').getAttribute('href');
      await page.keyboard.press('Enter');
      await page.waitForURL((url) => url.pathname === caseHref);
      await context.close();
    }
  });

  it('should zoom the Diagnose plot with the wheel, reset it with a double-click, and download its curves', async () => {
    const { context, page } = await open();
    await page.goto(`${app.server.baseUrl}/diagnose`);
    await page.getByRole('button', { name: 'Long ground clip on a fast edge' }).click();
    const chart = page.getByRole('list', { name: 'Causes, most likely first' }).getByRole('article').first().getByTestId('line-chart');
    await chart.locator('canvas').waitFor();
    await expect.poll(() => chart.getAttribute('data-x-max')).not.toBeNull();
    await chart.scrollIntoViewIfNeeded();
    const span = async () => Number(await chart.getAttribute('data-x-max')) - Number(await chart.getAttribute('data-x-min'));
    const whole = await span();
    const box = (await chart.locator('.u-over').boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.wheel(0, -400);
    await expect.poll(span).toBeLessThan(whole * 0.9);
    await screenshot(page, 'habits-diagnose-zoomed');
    await page.mouse.dblclick(box.x + box.width / 2, box.y + box.height / 2);
    await expect.poll(span).toBeCloseTo(whole, 9);

    // two fingers moving apart: pointer events as a touch screen sends them
    await chart.locator('.u-over').evaluate((over) => {
      const r = over.getBoundingClientRect();
      const y = r.top + r.height / 2;
      const send = (type: string, pointerId: number, x: number) =>
        over.dispatchEvent(new PointerEvent(type, { pointerId, pointerType: 'touch', clientX: x, clientY: y, bubbles: true, isPrimary: pointerId === 1 }));
      const mid = r.left + r.width / 2;
      send('pointerdown', 1, mid - 40);
      send('pointerdown', 2, mid + 40);
      send('pointermove', 1, mid - 120);
      send('pointermove', 2, mid + 120);
      send('pointerup', 1, mid - 120);
      send('pointerup', 2, mid + 120);
    });
    await expect.poll(span).toBeLessThan(whole * 0.6);
    await page.mouse.dblclick(box.x + box.width / 2, box.y + box.height / 2);
    await expect.poll(span).toBeCloseTo(whole, 9);

    // once the server has run the setup, the address holds it and can be copied
    await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: app.server.baseUrl });
    await page.getByRole('button', { name: 'Diagnose', exact: true }).click();
    await page.getByRole('button', { name: 'Copy link to this setup' }).click();
    await page.getByTestId('copy-link-status').getByText('Link copied').waitFor();
    const copied = await page.evaluate(() => navigator.clipboard.readText());
    expect(copied).toBe(page.url());
    expect(copied).toContain('probe.groundLeadM=0.15');

    const figure = page.getByRole('list', { name: 'Causes, most likely first' }).getByRole('article').first().locator('figure').first();
    const [download] = await Promise.all([page.waitForEvent('download'), figure.getByRole('button', { name: 'Download CSV (curves)' }).click()]);
    const csv = readFileSync((await download.path())!, 'utf8');
    const lines = csv.trimEnd().split('\r\n');
    expect(lines.length).toBeGreaterThan(10);
    expect(lines[0].split(',').length).toBeGreaterThan(1);
    expect(download.suggestedFilename()).toMatch(/\.csv$/);
    await context.close();
  });

  it('should zoom a capture with the wheel, show it all on a double-click, and download the plot and its readings', async () => {
    const { context, page } = await open();
    // a verified demo case that carries a capture
    const caseId = await page.evaluate(async () => {
      const list = (await (await fetch('/api/cases?status=verified&pageSize=100')).json()) as { cases: { id: number }[] };
      for (const { id } of list.cases) {
        const c = ((await (await fetch(`/api/cases/${id}`)).json()) as { case: { attachments: { kind: string }[] } }).case;
        if (c.attachments.some((a) => a.kind === 'capture')) return id;
      }
      return null;
    });
    expect(caseId).not.toBeNull();
    await page.goto(`${app.server.baseUrl}/cases/${caseId}`);
    const canvas = page.getByTestId('capture-canvas').first();
    await canvas.locator('canvas').waitFor();
    const view = page.getByTestId('plot-view').first();
    await view.getByText(/^Whole capture:/).waitFor();
    await canvas.scrollIntoViewIfNeeded();
    const span = async () => Number(await canvas.getAttribute('data-x-max')) - Number(await canvas.getAttribute('data-x-min'));
    const whole = await span();
    const box = (await canvas.locator('.u-over').boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.3, box.y + box.height / 2);
    await page.mouse.wheel(0, -400);
    await view.getByText(/^Zoomed:/).waitFor();
    await expect.poll(span).toBeLessThan(whole * 0.9);
    await screenshot(page, 'habits-capture-zoomed');
    await page.mouse.dblclick(box.x + box.width * 0.3, box.y + box.height / 2);
    await view.getByText(/^Whole capture:/).waitFor();
    expect(await span()).toBeCloseTo(whole, 12);
    // the two clicks of the double-click placed no cursor
    expect(await page.locator('dl[aria-label="Cursor readings"]').count()).toBe(0);

    const downloads = page.getByRole('group', { name: /^Download .* capture$/ }).first();
    const [csvDownload] = await Promise.all([page.waitForEvent('download'), downloads.getByRole('button', { name: 'Download CSV (readings)' }).click()]);
    const csv = readFileSync((await csvDownload.path())!, 'utf8');
    expect(csv.split('\r\n')[0]).toBe('quantity,value,unit');
    expect(csv).toMatch(/\r\nSamples,\d+,\r\n/);
    expect(csv).toMatch(/\r\nWindow shown from,[-\d.e]+,s\r\n/);
    const [pngDownload] = await Promise.all([page.waitForEvent('download'), downloads.getByRole('button', { name: 'Download PNG' }).click()]);
    const png = readFileSync((await pngDownload.path())!);
    // source: PNG specification (ISO/IEC 15948), 5.2 — the eight-byte signature
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(pngDownload.suggestedFilename()).toMatch(/capture\.png$/);
    await pngDownload.saveAs(path.join(SCREENSHOT_DIR, 'habits-capture-export.png'));
    // the spectrum is an SVG: drawn onto a canvas with the page's colours written in
    const spectrumDownloads = page.getByRole('group', { name: /^Download .* spectrum$/ }).first();
    const [spectrumPng] = await Promise.all([page.waitForEvent('download'), spectrumDownloads.getByRole('button', { name: 'Download PNG' }).click()]);
    expect([...readFileSync((await spectrumPng.path())!).subarray(0, 4)]).toEqual([0x89, 0x50, 0x4e, 0x47]);
    await spectrumPng.saveAs(path.join(SCREENSHOT_DIR, 'habits-spectrum-export.png'));
    const [spectrumCsv] = await Promise.all([page.waitForEvent('download'), spectrumDownloads.getByRole('button', { name: 'Download CSV (spectrum)' }).click()]);
    expect(readFileSync((await spectrumCsv.path())!, 'utf8').split('\r\n')[0]).toBe('frequency (Hz),amplitude (V)');
    await context.close();
  });

  it('should show the touched screens in light and dark', async () => {
    for (const colorScheme of ['light', 'dark'] as const) {
      const { context, page } = await open({ colorScheme });
      await page.goto(`${app.server.baseUrl}/?q=${encodeURIComponent('ringing at 110 MHz')}&cause=ground-lead`);
      await page.getByTestId('search-result').first().waitFor();
      await page.keyboard.press('j');
      await screenshot(page, `habits-bench-${colorScheme}`);
      await page.goto(`${app.server.baseUrl}/cases?status=verified&sort=title`);
      await page.locator('table tbody tr').first().waitFor();
      await page.keyboard.press('j');
      await screenshot(page, `habits-cases-${colorScheme}`);
      await page.goto(`${app.server.baseUrl}/diagnose?preset=long-ground-clip`);
      await page.locator('[data-testid="line-chart"] canvas').first().waitFor();
      await screenshot(page, `habits-diagnose-${colorScheme}`);
      await context.close();
    }
  });
});
