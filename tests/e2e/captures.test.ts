import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addNoise, sampleUniformly, secondOrderStep, stepWaveform } from '../../shared/capture/synthetic';
import { parseEngineering } from '../../shared/units/engineering';
import { launchBrowser, SCREENSHOT_DIR, screenshot, signIn, skipBrowser } from './helpers/browser';
import { dropFile, saved } from './helpers/case-form';
import { startRealServer, type RunningServer } from './helpers/server';

const TITLE = 'Clock edge rings after the long ground clip';
const RINGING_HZ = 115e6;
const ZETA = 0.09;

/**
 * A 0 → 1 V step at 200 ns through an underdamped second-order system (f_n 115 MHz, ζ 0.09),
 * sampled every 0.2 ns for 1.2 µs with a little noise: the ringing a 15 cm ground lead on a
 * 10 pF tip gives, written the way a scope exports it.
 */
function ringingCsv(): string {
  const { timesS, volts } = sampleUniformly(stepWaveform(secondOrderStep(RINGING_HZ, ZETA), 0, 1, 200e-9), { sampleIntervalS: 0.2e-9, points: 6000 });
  addNoise(volts, 0.002, 7);
  const lines = ['# exported from the bench', 'Time (us);Channel 1 (mV)'];
  for (let i = 0; i < timesS.length; i++) lines.push(`${(timesS[i] * 1e6).toFixed(5).replace('.', ',')};${(volts[i] * 1e3).toFixed(2).replace('.', ',')}`);
  return lines.join('\n');
}

/**
 * A two-channel bench export: a preamble saying the channel was at 1X, then CH1 a 10 kHz square
 * 0 → 3.3 V and CH2 a 20 kHz sine of 1 V peak, 1 ms at 0.5 µs (closed forms, written in mV).
 */
function twoChannelCsv(): string {
  const lines = ['Model,Bench scope', 'Vertical Units,mV', 'Probe,1X', 'Coupling,DC', 'Vertical Scale,1V', '', 'Time (s),CH1,CH2'];
  for (let k = 0; k < 2000; k++) {
    const t = k * 0.5e-6;
    lines.push(`${t.toExponential(6)},${Math.floor(t / 50e-6) % 2 ? 3300 : 0},${(1000 * Math.sin(2 * Math.PI * 20e3 * t)).toFixed(2)}`);
  }
  return lines.join('\r\n');
}

const value = (text: string, unit: string) => {
  const r = parseEngineering(text.replace(/\s*\(.*$/, '').trim(), unit);
  if (!r.ok) throw new Error(`cannot read "${text}": ${r.error}`);
  return r.value;
};

/** The viewport only: a full-page shot of a modal dialog shows the sticky bar in the middle of the page. */
async function viewportShot(page: Page, name: string) {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`) });
}

describe.skipIf(skipBrowser)('capture plots in a real browser', () => {
  let server: RunningServer;
  let browser: Browser;
  beforeAll(async () => {
    // with its log, to see the capture worker warmed up before the first upload
    [server, browser] = await Promise.all([startRealServer({ LOG_LEVEL: 'info' }), launchBrowser()]);
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('should fill the observed values from an uploaded capture, then plot it with levels, the model, zoom and cursors', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    try {
      await signIn(page, server.baseUrl, 'engineer@falsetrace.test');
      await page.goto(`${server.baseUrl}/cases/new`);
      await page.getByLabel('Title').fill(TITLE);
      await page.getByLabel('Symptom in one line').fill('About 115 MHz of ringing after every rising edge of the 25 Ω clock driver');
      await page.waitForURL(/\/cases\/\d+\/edit$/);
      const caseId = Number(/\/cases\/(\d+)\/edit/.exec(page.url())![1]);

      await page.getByLabel('Nominal attenuation').fill('10x');
      await page.getByLabel('Tip capacitance').fill('10 pF');
      await page.getByLabel('Ground connection').selectOption('clip-lead');
      await page.getByLabel('Ground lead length').fill('15 cm');
      await page.getByLabel('Channel attenuation setting').fill('10x');
      await page.getByLabel('Input resistance').selectOption('1000000');
      await page.getByLabel('Source impedance').fill('25 ohm');
      await page.getByLabel('Kind', { exact: true }).selectOption('pulse');
      await page.getByLabel('Amplitude', { exact: true }).fill('1 V');

      // the server warms its capture worker once search is ready, and the upload runs on that worker
      await expect.poll(() => server.log(), { timeout: 60_000 }).toMatch(/capture worker warmed up in \d+ ms/);
      await dropFile(page, 'clock-edge.csv', ringingCsv());
      const offer = page.getByRole('region', { name: 'Observed values from clock-edge.csv' });
      await offer.waitFor();
      // nothing is filled until the author confirms
      expect(await page.getByLabel('Observed amplitude').inputValue()).toBe('');
      await offer.getByRole('button', { name: 'Fill the observed values from this capture' }).click();
      const dialog = page.getByRole('dialog', { name: 'Fill the observed values from this capture?' });
      await dialog.getByRole('row', { name: /Ringing frequency/ }).waitFor();
      await viewportShot(page, 'capture-fill-dialog');
      await dialog.getByRole('button', { name: /^Fill these \d+ values$/ }).click();
      await dialog.waitFor({ state: 'detached' });

      // source: underdamped second-order step: overshoot exp(−πζ/√(1−ζ²)), ringing at f_n·√(1−ζ²)
      const root = Math.sqrt(1 - ZETA * ZETA);
      expect(value(await page.getByLabel('Observed amplitude').inputValue(), 'V')).toBeCloseTo(1, 1);
      expect(value(await page.getByLabel('Ringing frequency').inputValue(), 'Hz') / (RINGING_HZ * root)).toBeCloseTo(1, 1);
      expect(value((await page.getByLabel('Overshoot').inputValue()).replace('%', ''), '')).toBeCloseTo(100 * Math.exp((-Math.PI * ZETA) / root), -1);
      expect(value(await page.getByLabel('Observed rise time').inputValue(), 's')).toBeGreaterThan(0);
      await offer.getByText('The observed values match this capture.').waitFor();
      await page.getByRole('region', { name: 'Live diagnosis' }).getByText('1. Ground-lead ringing').waitFor();
      await saved(page);

      await page.goto(`${server.baseUrl}/cases/${caseId}`);
      const figure = page.getByRole('figure', { name: /Capture clock-edge\.csv/ });
      await figure.locator('canvas').waitFor();
      const legend = figure.getByRole('list', { name: 'Legend' });
      await legend.getByText(/^Model \(ground-lead ringing\)/).waitFor();
      await legend.getByText('Capture', { exact: true }).waitFor();
      await legend.getByText('Base, top and 10/50/90 % levels').waitFor();
      await legend.getByText('Measured edges (10, 50, 90 %)').waitFor();
      await expect(figure.getByTestId('plot-view').textContent()).resolves.toMatch(/^Whole capture: 0 s to 1\.2\d* µs, 6,000 samples as \d/);
      await expect(figure.textContent()).resolves.toMatch(/Dashed: Predicted step through the ground lead.*aligned at the 50 % point of the first rising edge/);
      await page.getByRole('list', { name: 'Captures' }).getByText('clock-edge.csv').first().waitFor();
      await figure.scrollIntoViewIfNeeded();
      await screenshot(page, 'capture-plot-desktop');

      // zoom: drag across the first edge; the window comes back at full resolution
      const over = figure.locator('.u-over');
      const box = (await over.boundingBox())!;
      await page.mouse.move(box.x + box.width * 0.15, box.y + box.height * 0.5);
      await page.mouse.down();
      await page.mouse.move(box.x + box.width * 0.2, box.y + box.height * 0.5, { steps: 4 });
      await page.mouse.move(box.x + box.width * 0.3, box.y + box.height * 0.5, { steps: 4 });
      await page.mouse.up();
      await figure.getByTestId('plot-view').getByText(/^Zoomed: .* all [\d,]+ samples$/).waitFor();
      await screenshot(page, 'capture-plot-zoomed');

      // cursors by clicking: A then B read Δt and ΔV
      await page.mouse.click(box.x + box.width * 0.3, box.y + box.height * 0.3);
      await page.mouse.click(box.x + box.width * 0.6, box.y + box.height * 0.3);
      const readings = figure.getByRole('definition').filter({ hasText: /s/ });
      await figure.getByTestId('cursor-dt').waitFor();
      expect(value(await figure.getByTestId('cursor-dt').textContent() ?? '', 's')).toBeGreaterThan(0);
      expect(await readings.count()).toBeGreaterThan(2);

      // cursors on the first edge read its 10–90 % rise time, the figure listed beside the plot
      await figure.getByRole('button', { name: 'Cursors on the first edge' }).click();
      const listedRise = await page.getByRole('list', { name: 'Captures' }).locator('div', { has: page.getByText('Rise time', { exact: true }) }).locator('dd').first().textContent();
      const dtS = value((await figure.getByTestId('cursor-dt').textContent()) ?? '', 's');
      expect(dtS / value(listedRise ?? '', 's')).toBeCloseTo(1, 2);
      // 10 % to 90 % of the amplitude. source: IEEE Std 181-2011, 5.3.3 (transition duration)
      expect(value((await figure.getByTestId('cursor-dv').textContent()) ?? '', 'V')).toBeCloseTo(0.8, 1);
      await figure.scrollIntoViewIfNeeded();
      await screenshot(page, 'capture-plot-cursors');

      await figure.getByRole('button', { name: 'Pan later' }).click();
      await figure.getByTestId('plot-view').getByText(/^Zoomed:/).waitFor();
      await figure.getByRole('button', { name: 'Show all' }).click();
      await figure.getByTestId('plot-view').getByText(/^Whole capture:/).waitFor();

      const phone = await (await browser.newContext({ viewport: { width: 390, height: 844 }, storageState: await context.storageState() })).newPage();
      await phone.goto(`${server.baseUrl}/cases/${caseId}`);
      const phoneFigure = phone.getByRole('figure', { name: /Capture clock-edge\.csv/ });
      await phoneFigure.locator('canvas').waitFor();
      const overflow = await phone.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(overflow).toBeLessThanOrEqual(0);
      await phoneFigure.getByRole('button', { name: 'Zoom in' }).click();
      await phoneFigure.getByTestId('plot-view').getByText(/^Zoomed:/).waitFor();
      await phoneFigure.getByRole('button', { name: 'Cursors on the first edge' }).click();
      await phoneFigure.getByTestId('cursor-dt').waitFor();
      await phoneFigure.scrollIntoViewIfNeeded();
      await screenshot(phone, 'capture-plot-phone');
      await phone.context().close();
    } catch (err) {
      await screenshot(page, 'captures-failure');
      throw err;
    } finally {
      await context.close();
    }
  }, 120_000);

  it('should plot both channels of a capture, switch the analysed one, and fill the setup from the preamble with a visible conflict', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    try {
      await signIn(page, server.baseUrl, 'engineer@falsetrace.test');
      await page.goto(`${server.baseUrl}/cases/new`);
      await page.getByLabel('Title').fill('Square reads a tenth on the bench export');
      await page.getByLabel('Symptom in one line').fill('The exported square is 3.3 V where the screen showed 0.33 V');
      await page.waitForURL(/\/cases\/\d+\/edit$/);
      const caseId = Number(/\/cases\/(\d+)\/edit/.exec(page.url())![1]);
      await page.getByLabel('Channel attenuation setting').fill('10x');

      await dropFile(page, 'two-channels.csv', twoChannelCsv());
      const settings = page.getByRole('region', { name: 'Settings from two-channels.csv' });
      await settings.waitFor();
      // the file says 1X, the case says 10x: shown on the form before anything is filled
      await settings.getByRole('alert').getByText(/The file says the channel was set to 1X; the case records 10X\./).waitFor();
      await settings.scrollIntoViewIfNeeded();
      await viewportShot(page, 'capture-setup-conflict');
      await settings.getByRole('button', { name: 'Fill the setup from this file' }).click();
      const dialog = page.getByRole('dialog', { name: 'Fill the setup from the capture file?' });
      await dialog.getByRole('row', { name: /Channel attenuation setting/ }).waitFor();
      await dialog.getByRole('button', { name: /^Fill / }).click();
      await dialog.waitFor({ state: 'detached' });
      expect(await page.getByLabel('Channel attenuation setting').inputValue()).toMatch(/^1 ?x$/i);
      await settings.getByText("The setup matches the file's settings.").waitFor();
      await saved(page);

      await page.goto(`${server.baseUrl}/cases/${caseId}`);
      const figure = page.getByRole('figure', { name: /Capture two-channels\.csv/ });
      await figure.locator('canvas').first().waitFor();
      const legend = figure.getByRole('list', { name: 'Legend' });
      await legend.getByText('CH1 (analysed)').waitFor();
      await legend.getByText('CH2', { exact: true }).waitFor();
      // both traces drawn: ink for the analysed channel, amber (our caution colour) for the other
      const inkAndAmber = () =>
        figure.locator('canvas').first().evaluate((canvas: HTMLCanvasElement) => {
          const { data } = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height);
          const css = getComputedStyle(document.documentElement);
          const rgb = (name: string) => css.getPropertyValue(name).trim().match(/[0-9a-f]{2}/gi)!.map((h) => parseInt(h, 16));
          const count = ([r, g, b]: number[]) => {
            let n = 0;
            for (let i = 0; i < data.length; i += 4) if (Math.abs(data[i] - r) + Math.abs(data[i + 1] - g) + Math.abs(data[i + 2] - b) < 40) n++;
            return n;
          };
          return Math.min(count(rgb('--ft-ink')), count(rgb('--ft-caution')));
        });
      await expect.poll(inkAndAmber).toBeGreaterThan(100);
      await figure.getByRole('figure', { name: 'Spectrum of the analysed channel' }).waitFor();
      await figure.scrollIntoViewIfNeeded();
      await screenshot(page, 'capture-two-channels');

      await figure.getByLabel('Analysed channel', { exact: true }).selectOption('2');
      await legend.getByText('CH2 (analysed)').waitFor();
      await legend.getByText('CH1', { exact: true }).waitFor();
      await page.getByRole('list', { name: 'Captures' }).getByText(/Shape\s*sine/).waitFor();
      // the ink trace is now the sine of CH2 (±1 V), the amber one the square of CH1
      await expect.poll(inkAndAmber).toBeGreaterThan(100);
      await figure.scrollIntoViewIfNeeded();
      await screenshot(page, 'capture-two-channels-switched');

      // a second capture, taken after the fix, compared with the first on one time axis
      await page.evaluate(
        async ([id, text]) => {
          const { csrfToken } = await (await fetch('/api/auth/csrf')).json();
          const body = new FormData();
          body.append('file', new File([text], 'after-fix.csv', { type: 'text/csv' }));
          const res = await fetch(`/api/cases/${id}/attachments`, { method: 'POST', body, headers: { 'x-csrf-token': csrfToken } });
          if (res.status !== 201) throw new Error(`upload answered ${res.status}`);
        },
        [caseId, twoChannelCsv().replace(/,(\d+),(-?[\d.]+)\r?$/gm, (_, sq, sine) => `,${Math.round(Number(sq) / 10)},${sine}`)] as const,
      );
      await page.reload();
      await figure.getByLabel('Taken before or after the fix').selectOption('before');
      const afterFigure = page.getByRole('figure', { name: /Capture after-fix\.csv/ });
      await afterFigure.getByLabel('Taken before or after the fix').selectOption('after');
      const comparison = page.getByRole('region', { name: 'Before and after the fix' });
      await comparison.locator('canvas').first().waitFor();
      await comparison.getByRole('row', { name: /Amplitude/ }).waitFor();
      await comparison.scrollIntoViewIfNeeded();
      await screenshot(page, 'capture-before-after');
    } catch (err) {
      await screenshot(page, 'captures-two-channels-failure');
      throw err;
    } finally {
      await context.close();
    }
  }, 120_000);
});
