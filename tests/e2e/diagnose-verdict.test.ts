import type { Browser, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import path from 'node:path';
import { SCREENSHOT_DIR, screenshot, signIn, skipBrowser } from './helpers/browser';
import { saved } from './helpers/case-form';
import { useRealApp } from './helpers/real-app';

const causes = (page: Page) => page.getByRole('list', { name: 'Causes, most likely first' }).getByRole('article');
const verdict = (page: Page) => page.getByTestId('verdict').first();

async function signedInPage(browser: Browser, baseUrl: string, email: string, colorScheme: 'light' | 'dark' = 'light') {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, colorScheme });
  const page = await context.newPage();
  await signIn(page, baseUrl, email);
  return { context, page };
}

describe.skipIf(skipBrowser)('verdicts, new setup fields and the safety note in a real browser', () => {
  const app = useRealApp();

  it('should call a consistent setup true, in light and dark', async () => {
    for (const scheme of ['light', 'dark'] as const) {
      const { context, page } = await signedInPage(app.browser, app.server.baseUrl, 'engineer@falsetrace.test', scheme);
      await page.goto(`${app.server.baseUrl}/diagnose`);
      await page.getByRole('heading', { name: 'Diagnose', level: 1 }).waitFor();
      await page.getByRole('button', { name: 'Consistent setup' }).click();
      expect(await page.getByLabel('Ground lead length', { exact: true }).inputValue()).toBe('1 cm');
      // a 10x probe on a spring, a 500 MHz chain, and the trace the setup predicts: the trace is true
      await page.locator('[data-testid="verdict"][data-verdict="faithful"]').waitFor();
      await verdict(page).getByText('The trace is true').waitFor();
      await verdict(page).getByText(/Debug the circuit, not the probe/).waitFor();
      await page.getByRole('button', { name: 'Diagnose', exact: true }).click();
      await page.getByTestId('server-check').getByText(/agrees/).waitFor();
      await screenshot(page, `diagnose-faithful-${scheme}`);
      await context.close();
    }
  });

  it('should not call a trace true that the recorded channel setting rules out', async () => {
    const { context, page } = await signedInPage(app.browser, app.server.baseUrl, 'engineer@falsetrace.test');
    await page.goto(`${app.server.baseUrl}/diagnose`);
    await page.getByRole('heading', { name: 'Diagnose', level: 1 }).waitFor();
    await page.getByRole('button', { name: 'Consistent setup' }).click();
    await page.locator('[data-testid="verdict"][data-verdict="faithful"]').waitFor();
    // the same trace, but the channel recorded at 1x under the 10x probe: the scope would show a tenth
    await page.getByLabel('Channel attenuation setting', { exact: true }).fill('1x');
    await page.locator('[data-testid="verdict"][data-verdict="unexplained"]').waitFor();
    await verdict(page).getByText('The record rules out what was seen').waitFor();
    await verdict(page).getByText(/The channel assumes 1x but the probe divides by 10/).waitFor();
    // every cause that leaves the recorded ratio out says so on its card (folded among the unlikely ones)
    await page.getByText(/^Unlikely here/).click();
    await page.getByText('ruled out by the record: Attenuation setting mismatch').first().waitFor();
    await page.getByRole('button', { name: 'Diagnose', exact: true }).click();
    await page.getByTestId('server-check').getByText(/agrees/).waitFor();
    await screenshot(page, 'diagnose-record-rules-out');
    await context.close();
  });

  it('should name both causes of a 10x probe read at 1x that also rings on a 15 cm lead', async () => {
    const { context, page } = await signedInPage(app.browser, app.server.baseUrl, 'engineer@falsetrace.test');
    await page.goto(`${app.server.baseUrl}/diagnose?preset=ten-x-at-one-x-long-lead`);
    await page.getByRole('heading', { name: 'Diagnose', level: 1 }).waitFor();
    expect(await page.getByLabel('Channel attenuation setting', { exact: true }).inputValue()).toBe('1x');
    const combined = causes(page).filter({ has: page.getByRole('heading', { name: /Attenuation setting mismatch \+ Ground-lead ringing|Ground-lead ringing \+ Attenuation setting mismatch/ }) });
    await combined.first().waitFor();
    await combined.first().getByText(/does not fit|fits/).first().waitFor();
    await combined.first().getByText(/Confirm at the bench:/).waitFor();
    await verdict(page).waitFor();
    await screenshot(page, 'diagnose-combined');
    await context.close();
  });

  it('should rank each new cause first on its own preset, with its plot where the cause has one', async () => {
    const { context, page } = await signedInPage(app.browser, app.server.baseUrl, 'engineer@falsetrace.test');
    // preset → the cause its invented numbers were chosen to show (src/features/diagnosis/form/presets.ts)
    const presets: [string, string][] = [
      ['slow-sample-rate', 'Aliasing: sample rate too low'],
      ['trace-off-screen', 'Clipping: trace beyond the screen'],
      ['ac-coupled-square', 'AC coupling droop or lost DC level'],
      ['shunt-on-a-48-v-rail', 'Common-mode or reference error'],
      ['hum-on-a-sensor', 'Mains hum or ground loop'],
      ['generator-set-for-50-ohm', 'Generator load setting mismatch'],
    ];
    for (const [preset, label] of presets) {
      await page.goto(`${app.server.baseUrl}/diagnose?preset=${preset}`);
      const top = causes(page).first();
      await top.getByRole('heading', { name: new RegExp(`^1\\.\\s*${label.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}$`) }).waitFor();
      // hum is a spectral line the explanation names; it has no plot of its own
      if (preset === 'hum-on-a-sensor') await top.getByText(/^No plot:/).waitFor();
      else await top.locator('figure').first().waitFor();
    }
    await screenshot(page, 'diagnose-generator-load');
    await context.close();
  });

  it('should fold the new field groups until they are needed and open them for a preset that fills them', async () => {
    const { context, page } = await signedInPage(app.browser, app.server.baseUrl, 'engineer@falsetrace.test');
    await page.goto(`${app.server.baseUrl}/diagnose`);
    await page.getByRole('heading', { name: 'Diagnose', level: 1 }).waitFor();
    for (const group of ['acquisition', 'grounding', 'source']) {
      expect(await page.locator(`details[data-group="${group}"]`).getAttribute('open')).toBeNull();
    }
    expect(await page.getByLabel('Sample rate', { exact: true }).isVisible()).toBe(false);
    await page.locator('details[data-group="grounding"] summary').click();
    await page.getByLabel('Probe kind', { exact: true }).selectOption('differential');
    await page.getByLabel('Probe CMRR', { exact: true }).fill('40 dB');

    await page.getByRole('button', { name: 'Trace beyond the screen' }).click();
    await page.getByLabel('Vertical scale', { exact: true }).waitFor({ state: 'visible' });
    expect(await page.getByLabel('Vertical scale', { exact: true }).inputValue()).toBe('500 mV/div');
    expect(await page.getByLabel('Clipped at the screen edge', { exact: true }).inputValue()).toBe('true');
    expect(page.url()).toContain('preset=trace-off-screen');
    // the observation's new rows reach the predicted-against-observed table
    await page.getByRole('button', { name: 'Clock on a long timebase' }).click();
    await page.getByLabel('Sample rate', { exact: true }).waitFor({ state: 'visible' });
    await causes(page).first().getByRole('row', { name: /Frequency/ }).waitFor();
    await screenshot(page, 'diagnose-new-groups');

    await page.getByRole('button', { name: 'Shunt on a 48 V rail' }).click();
    expect(await page.getByLabel('Reference node voltage', { exact: true }).inputValue()).toBe('48 V');
    await screenshot(page, 'diagnose-common-mode');
    await context.close();
  });

  it('should carry the new fields and the safety note from the case form to the case page and the review checklist', async () => {
    const eng = await signedInPage(app.browser, app.server.baseUrl, 'engineer@falsetrace.test');
    const page = eng.page;
    await page.goto(`${app.server.baseUrl}/cases/new`);
    await page.getByLabel('Title', { exact: true }).fill('Bus hum on the sensor input');
    await page.getByLabel('Symptom in one line', { exact: true }).fill('50 Hz hum three times the sensor signal');
    await page.getByLabel('Mains-connected equipment', { exact: true }).selectOption('yes');
    await page.getByLabel('Highest voltage present', { exact: true }).fill('325 V');
    // the caution cites the standard's own levels and labels any lower threshold as ours
    const caution = page.getByTestId('safety-caution').first();
    // the engine's risk and the caution's own citation both name the clause; either may be folded
    await caution.getByText(/IEC 61010-1:2010, 6\.3\.1/).first().waitFor({ state: 'attached' });
    const cited = (await caution.textContent()) ?? '';
    for (const level of ['33 V rms', '46.7 V peak', '70 V DC', '16 V rms', '22.6 V peak', '35 V DC']) expect(cited).toContain(level);

    for (const group of ['Acquisition', 'Grounding and reference', 'Source']) {
      await page.locator(`details[data-group="${group}"] summary`).click();
    }
    await page.getByLabel('Sample rate', { exact: true }).fill('1 MSa/s');
    await page.getByLabel('Vertical scale', { exact: true }).fill('20 mV/div');
    await page.getByLabel('Coupling', { exact: true }).selectOption('ac');
    await page.getByLabel('AC-coupling corner', { exact: true }).fill('10 Hz');
    await page.getByLabel('Mains frequency', { exact: true }).fill('50 Hz');
    await page.getByLabel('Load resistance', { exact: true }).fill('1 MΩ');
    await page.getByLabel('Amplitude', { exact: true }).fill('20 mV');
    await page.getByLabel('Observed amplitude', { exact: true }).fill('65 mV');
    await page.getByLabel('Hum frequency', { exact: true }).fill('50 Hz');
    await page.getByLabel('Clipped at the screen edge', { exact: true }).selectOption('no');
    await page.getByLabel('Stated cause', { exact: true }).selectOption('mains-pickup');
    // a mains setup at 325 V: the engine raises a risk, so the safety note is asked for, not merely offered
    await page.getByText(/^Needed for review: the engine raises a risk for this setup/).waitFor();
    const note = 'Sensor board fed from an isolating transformer; differential probe rated 1000 V CAT II; scope left earthed.';
    await page.getByLabel('Safety note', { exact: true }).fill(note);
    await saved(page);
    await screenshot(page, 'case-form-new-groups');
    // the live panel leads with the verdict; shot on its own, since the full page cannot show a sticky column
    const panel = page.getByRole('region', { name: 'Live diagnosis' });
    await panel.getByTestId('verdict').waitFor();
    await panel.screenshot({ path: path.join(SCREENSHOT_DIR, 'case-form-live-panel.png') });

    const caseId = Number(/\/cases\/(\d+)\/edit/.exec(page.url())?.[1]);
    expect(caseId).toBeGreaterThan(0);
    await page.goto(`${app.server.baseUrl}/cases/${caseId}`);
    await page.getByRole('heading', { name: 'Bus hum on the sensor input' }).waitFor();
    await page.getByText(note).waitFor();
    await page.getByText('1 MSa/s', { exact: true }).waitFor();
    await page.getByText('20 mV/div', { exact: true }).waitFor();
    await page.getByTestId('verdict').first().waitFor();
    await screenshot(page, 'case-page-safety-note');

    await page.goto(`${app.server.baseUrl}/cases/${caseId}/edit`);
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Submit for review' }).click();
    await page.getByText(/In review/).first().waitFor();
    await eng.context.close();

    const mod = await signedInPage(app.browser, app.server.baseUrl, 'moderator@falsetrace.test');
    await mod.page.goto(`${app.server.baseUrl}/review`);
    const card = mod.page.locator(`article[data-case-id="${caseId}"]`);
    await card.waitFor();
    const safety = card.locator('[data-check="safety"]');
    expect(await safety.getAttribute('data-state')).toBe('pass');
    expect(await safety.textContent()).toContain('isolating transformer');
    await card.scrollIntoViewIfNeeded();
    await screenshot(mod.page, 'review-safety-note');
    await mod.context.close();
  });
});
