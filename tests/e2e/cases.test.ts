import { Jimp } from 'jimp';
import type { Browser, BrowserContext, Page, Route } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, screenshot, signIn, skipBrowser } from './helpers/browser';
import { dropFile, saved } from './helpers/case-form';
import { startRealServer, type RunningServer } from './helpers/server';

const TITLE = 'Gate drive read as a tenth on the half-bridge board';

/** A small PNG of a square-ish trace, built here so the upload is a real image the server re-encodes. */
async function tracePng(): Promise<string> {
  const img = new Jimp({ width: 320, height: 180, color: 0xf6f1e6ff });
  for (let x = 0; x < 320; x++) {
    const high = Math.floor(x / 40) % 2 === 0;
    const y = high ? 50 : 130;
    for (let dy = 0; dy < 3; dy++) img.setPixelColor(0x1c2a45ff, x, y + dy);
    if (x % 40 === 0) for (let yy = 50; yy <= 132; yy++) img.setPixelColor(0x1c2a45ff, x, yy);
  }
  return (await img.getBuffer('image/png')).toString('base64');
}

/** A 1 MHz square wave of 0.33 V sampled every 1 ns, with finite edges, as a scope would export it. */
function squareCsv(): string {
  const lines = ['time,voltage'];
  for (let i = 0; i < 4000; i++) {
    const t = i * 1e-9;
    const phase = (t * 1e6) % 1;
    const edge = 20e-9 * 1e6; // 20 ns edges, as a fraction of the period
    let v: number;
    if (phase < edge) v = (0.33 * phase) / edge;
    else if (phase < 0.5) v = 0.33;
    else if (phase < 0.5 + edge) v = 0.33 * (1 - (phase - 0.5) / edge);
    else v = 0;
    lines.push(`${t.toExponential(6)},${v.toFixed(5)}`);
  }
  return lines.join('\n');
}

async function pasteImage(page: Page, base64: string) {
  await page.evaluate((b64) => {
    const bytes = Uint8Array.from(atob(b64), (c) => c.charCodeAt(0));
    const dt = new DataTransfer();
    dt.items.add(new File([bytes], 'image.png', { type: 'image/png' }));
    document.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
  }, base64);
}

/** Full-page screenshot from the top, so sticky bars and panels sit where a reader first sees them. */
async function shot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await screenshot(page, name);
}

describe.skipIf(skipBrowser)('case write-ups in a real browser', () => {
  let server: RunningServer;
  let browser: Browser;
  let caseId = 0;
  beforeAll(async () => {
    [server, browser] = await Promise.all([startRealServer(), launchBrowser()]);
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('should let an engineer file a full case with a pasted screenshot and a dropped capture, survive a reload, and submit it', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    try {
      await fileACase(page, context);
    } catch (err) {
      await screenshot(page, 'cases-failure-engineer');
      throw err;
    } finally {
      await context.close();
    }
  }, 120_000);

  async function fileACase(page: Page, context: BrowserContext) {
    await signIn(page, server.baseUrl, 'engineer@falsetrace.test');
    await page.goto(`${server.baseUrl}/cases/new`);

    // the first save needs a title and a summary; it creates the draft and moves to its edit page
    await page.getByLabel('Title').fill(TITLE);
    await page.getByLabel('Symptom in one line').fill('Gate pulses showed 1.2 V where the driver puts out 12 V');
    // typing on while the first save creates the case: the same field stays, with focus and text
    const narrative = await page.getByLabel('Narrative', { exact: true }).elementHandle();
    await narrative!.focus();
    await page.keyboard.type('Probing the **low-side gate** ');
    await page.waitForURL(/\/cases\/\d+\/edit$/);
    caseId = Number(/\/cases\/(\d+)\/edit/.exec(page.url())![1]);
    await page.keyboard.type('with the bench probe.');
    expect(await narrative!.evaluate((el) => el.isConnected && document.activeElement === el)).toBe(true);
    await expect(page.getByLabel('Narrative', { exact: true }).inputValue()).resolves.toBe('Probing the **low-side gate** with the bench probe.');

    await page.getByLabel('Narrative', { exact: true }).fill('Probing the **low-side gate** with the bench probe.\n\n- probe switch at 10x\n- channel still set to 1x from the last job');
    await page.getByRole('region', { name: 'Narrative preview' }).getByText('low-side gate').waitFor();

    // engineering notation, echoed back as understood
    await page.getByLabel('Nominal attenuation').fill('10x');
    await page.getByLabel('Switchable (1x / 10x)').check();
    await page.getByLabel('Switch position').fill('10x');
    await page.getByLabel('Tip resistance').fill('9Meg');
    await expect.poll(() => page.locator('output', { hasText: '= 9 MΩ' }).count()).toBe(1);
    await page.getByLabel('Tip capacitance').fill('11.5p');
    await page.getByLabel('Probe bandwidth').fill('200 MHz');
    await page.getByLabel('Ground connection').selectOption('clip-lead');
    await page.getByLabel('Ground lead length').fill('15 cm');
    await page.getByLabel('Channel attenuation setting').fill('1x');
    await page.getByLabel('Input resistance').selectOption('1000000');
    await page.getByLabel('Channel bandwidth').fill('200 MHz');

    // what cannot be parsed says so under the field, and blocks the save until fixed
    await page.getByLabel('Source impedance').fill('12 furlongs');
    await page.getByLabel('Source impedance').blur();
    await page.getByText(/Cannot read this: unknown prefix or unit/).waitFor();
    await page.getByLabel('Source impedance').fill('10 ohm');
    await page.getByText(/Cannot read this/).waitFor({ state: 'detached' });

    await page.getByLabel('Node probed').fill('low-side gate, after the 4.7 Ω gate resistor');
    await page.getByLabel('Mains-connected equipment').selectOption('no');
    // above 60 V DC the red caution appears; the board's real maximum does not need it
    await page.getByLabel('Highest voltage present').fill('400 V');
    await page.getByRole('alert', { name: 'Safety caution' }).waitFor();
    await page.getByLabel('Highest voltage present').fill('24 V');
    await page.getByRole('alert', { name: 'Safety caution' }).waitFor({ state: 'detached' });

    await page.getByLabel('Kind', { exact: true }).selectOption('square');
    await page.getByLabel('Amplitude', { exact: true }).fill('12 V');
    await page.getByLabel('Frequency', { exact: true }).fill('100 kHz');
    await page.getByLabel('Observed amplitude').fill('1.2');
    await page.getByLabel('What the trace looked like').fill('Clean edges, but a tenth of the drive level.');

    // the live panel ranks the attenuation mismatch first for a 10x probe on a channel set to 1x
    const panel = page.getByRole('region', { name: 'Live diagnosis' });
    await panel.getByText('1. Attenuation setting mismatch').waitFor();

    await pasteImage(page, await tracePng());
    await page.getByRole('img', { name: /^Screenshot pasted-/ }).waitFor();
    await dropFile(page, 'gate-capture.csv', squareCsv());
    await page.getByRole('button', { name: 'Remove gate-capture.csv' }).waitFor();

    await page.getByLabel('Stated cause').selectOption('attenuation-mismatch');
    await page.getByLabel('Fix', { exact: true }).fill('Set the channel to 10x; the gate read 12 V.');
    await page.getByLabel('Lesson in one line').fill('Check the channel probe setting after swapping probes');
    await page.getByLabel('Tags', { exact: true }).fill('gate-drive');
    await page.getByLabel('Tags', { exact: true }).press('Enter');
    await page.getByLabel('Tags', { exact: true }).fill('switchable probe');
    await page.getByLabel('Tags', { exact: true }).press('Enter');
    await page.getByRole('button', { name: 'Remove switchable-probe' }).waitFor();
    await saved(page);
    await shot(page, 'case-form-desktop');

    // autosave survived: a reload shows the saved values
    await page.reload();
    await expect(page.getByLabel('Title').inputValue()).resolves.toBe(TITLE);
    await expect(page.getByLabel('Tip resistance').inputValue()).resolves.toBe('9 MΩ');
    await expect(page.getByLabel('Ground lead length').inputValue()).resolves.toBe('150 mm');

    // an edit reloaded away before the autosave fires is offered back from this browser; its save
    // is refused on the way, since a reload slower than the autosave delay would let it through
    const refuseSave = (route: Route) => (route.request().method() === 'PATCH' ? route.abort() : route.fallback());
    await page.route(`**/api/cases/${caseId}`, refuseSave);
    await page.getByLabel('Lesson detail').fill('The scope cannot sense the switch on this probe, so the channel kept 1x.');
    await page.reload();
    await page.getByText('Unsaved edits found in this browser').waitFor();
    await page.unroute(`**/api/cases/${caseId}`, refuseSave);
    await page.getByRole('button', { name: 'Restore my edits' }).click();
    await expect(page.getByLabel('Lesson detail').inputValue()).resolves.toBe('The scope cannot sense the switch on this probe, so the channel kept 1x.');
    await saved(page);

    const phone = await (await browser.newContext({ viewport: { width: 390, height: 844 }, storageState: await context.storageState() })).newPage();
    await phone.goto(`${server.baseUrl}/cases/${caseId}/edit`);
    await phone.getByLabel('Title').waitFor();
    await shot(phone, 'case-form-phone');

    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.getByRole('dialog', { name: 'Submit this case for review?' }).getByRole('button', { name: 'Submit for review' }).click();
    await page.waitForURL(new RegExp(`/cases/${caseId}$`));

    // the case page
    await page.getByRole('heading', { name: TITLE }).waitFor();
    await page.getByText('In review').first().waitFor();
    const setup = page.locator('dl').filter({ hasText: 'Tip resistance' });
    await setup.getByText('9 MΩ').waitFor();
    await setup.getByText('11.5 pF').waitFor();
    await page.getByRole('list', { name: 'Captures' }).getByText('gate-capture.csv').waitFor();
    await page.getByText('Check the channel probe setting after swapping probes').waitFor();
    await page.getByRole('button', { name: /^Open screenshot 1 of 1/ }).click();
    const lightbox = page.getByRole('dialog', { name: /^Screenshot 1 of 1/ });
    await lightbox.waitFor();
    await page.keyboard.press('Escape');
    await lightbox.waitFor({ state: 'detached' });
    await page.getByLabel('Add a comment').fill('Same thing bit us on the **motor board** last year.');
    await page.getByRole('button', { name: 'Post comment' }).click();
    await page.getByRole('listitem').filter({ hasText: 'motor board' }).waitFor();
    await page.getByText(/One revision so far/).waitFor();
    await shot(page, 'case-page-desktop');
    await phone.goto(`${server.baseUrl}/cases/${caseId}`);
    await phone.getByRole('heading', { name: TITLE }).waitFor();
    await shot(phone, 'case-page-phone');

    // the table shows it, filtered by status through the URL
    await page.goto(`${server.baseUrl}/cases`);
    await page.getByRole('link', { name: TITLE }).first().waitFor();
    await page.getByLabel('Status', { exact: true }).selectOption('in_review');
    await page.waitForURL(/status=in_review/);
    await page.getByRole('link', { name: TITLE }).first().waitFor();
    await shot(page, 'cases-table-desktop');
    await page.getByLabel('Tag', { exact: true }).fill('no-such-tag');
    await page.getByText(/No case matches these filters/).waitFor();
    await page.goBack();
    await page.waitForURL((u) => !u.search.includes('tag='));
    await page.getByRole('link', { name: TITLE }).first().waitFor();
    await phone.goto(`${server.baseUrl}/cases`);
    await phone.getByRole('link', { name: TITLE }).first().waitFor();
    await shot(phone, 'cases-table-phone');

    await phone.context().close();
  }

  it('should let a moderator hide a comment and edit the case under review, leaving a revision diff', async () => {
    expect(caseId).toBeGreaterThan(0);
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    try {
      await signIn(page, server.baseUrl, 'moderator@falsetrace.test');
      await page.goto(`${server.baseUrl}/cases/${caseId}`);
      const comment = page.getByRole('listitem').filter({ hasText: 'motor board' });
      await comment.getByRole('button', { name: 'Hide' }).click();
      await comment.getByText('hidden by a moderator').waitFor();

      await page.getByRole('link', { name: 'Edit', exact: true }).click();
      await page.getByLabel('Fix', { exact: true }).fill('Set the channel to 10x and labelled the probe; the gate read 12 V.');
      await saved(page);
      await page.goto(`${server.baseUrl}/cases/${caseId}`);
      const diff = page.getByLabel('Changes from revision 1 to 2');
      await diff.getByText('Fix: Set the channel to 10x and labelled the probe; the gate read 12 V.').waitFor();
      await diff.getByText('Fix: Set the channel to 10x; the gate read 12 V.').waitFor();
      await page.getByRole('heading', { name: 'Revision history' }).scrollIntoViewIfNeeded();
      await shot(page, 'case-history-desktop');
    } catch (err) {
      await screenshot(page, 'cases-failure-moderator');
      throw err;
    } finally {
      await context.close();
    }
  });

  it('should list my drafts and recently verified cases on the Bench', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    try {
      await signIn(page, server.baseUrl, 'engineer@falsetrace.test');
      await page.goto(`${server.baseUrl}/cases/new`);
      await page.getByLabel('Title').fill('Half-finished: ringing on the SPI clock');
      await page.getByLabel('Symptom in one line').fill('Ringing at about 150 MHz after each edge');
      await page.waitForURL(/\/cases\/\d+\/edit$/);
      const draftId = Number(/\/cases\/(\d+)\/edit/.exec(page.url())![1]);
      await saved(page);
      await page.getByRole('link', { name: 'Bench' }).click();
      const drafts = page.getByRole('region', { name: 'My drafts' }).or(page.locator('section', { has: page.getByRole('heading', { name: 'My drafts' }) }));
      // this draft's link: a retry leaves the first attempt's draft of the same title beside it
      await drafts.getByRole('link', { name: 'Half-finished: ringing on the SPI clock' }).and(page.locator(`[href="/cases/${draftId}/edit"]`)).waitFor();
      await shot(page, 'bench-with-cases');
    } catch (err) {
      await screenshot(page, 'cases-failure-bench');
      throw err;
    } finally {
      await context.close();
    }
  });
});
