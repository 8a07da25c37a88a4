import { createRequire } from 'node:module';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, screenshot, signIn, skipBrowser } from './helpers/browser';
import { startRealServer, type RunningServer } from './helpers/server';

const AXE_PATH = createRequire(import.meta.url).resolve('axe-core/axe.min.js');

interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[]; failureSummary?: string }[];
}

/** Runs axe-core (the accessibility engine) in the page; the serious and critical findings, readable. */
async function seriousViolations(page: Page): Promise<string[]> {
  await page.addScriptTag({ path: AXE_PATH });
  const violations = (await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: unknown[] }> } }).axe;
    return (await axe.run(document, { resultTypes: ['violations'] })).violations;
  })) as AxeViolation[];
  return violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.impact} ${v.id}: ${v.help} — ${v.nodes.slice(0, 4).map((n) => `${n.target.join(' ')} (${(n.failureSummary ?? '').replace(/\s+/g, ' ').slice(0, 160)})`).join('; ')}`);
}

describe.skipIf(skipBrowser)('accessibility (axe) of the main screens, light and dark', () => {
  let server: RunningServer;
  let browser: Browser;
  let caseId = 0;
  beforeAll(async () => {
    // the demo casebook is seeded on the first start, so every screen has something on it
    [server, browser] = await Promise.all([startRealServer(), launchBrowser()]);
  }, 120_000);
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  for (const scheme of ['light', 'dark'] as const) {
    it(`should have no serious or critical violation in the ${scheme} theme`, async () => {
      // the theme follows the system until the user picks one
      // bypassCSP: axe is injected as a script of the test's own, which the app's policy rightly refuses
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, colorScheme: scheme, bypassCSP: true });
      const page = await context.newPage();
      await signIn(page, server.baseUrl, 'moderator@falsetrace.test');
      if (!caseId) {
        const res = await context.request.get(`${server.baseUrl}/api/cases?status=verified&pageSize=1`);
        caseId = ((await res.json()) as { cases: { id: number }[] }).cases[0].id;
      }
      const screens: { name: string; path: string; ready: (p: Page) => Promise<unknown> }[] = [
        { name: 'bench', path: '/', ready: (p) => p.getByRole('heading', { name: 'What is the trace doing?' }).waitFor() },
        {
          name: 'bench-search',
          path: '/',
          ready: async (p) => {
            await p.getByRole('searchbox', { name: 'Symptom search' }).fill('ringing after edges ');
            await p.getByTestId('search-total').filter({ hasText: /\d+ case/ }).waitFor();
          },
        },
        { name: 'cases', path: '/cases', ready: (p) => p.getByRole('status').filter({ hasText: /of \d+ cases/ }).waitFor() },
        { name: 'case', path: `/cases/${caseId}`, ready: (p) => p.getByRole('heading', { name: 'Setup' }).waitFor() },
        { name: 'diagnose', path: '/diagnose', ready: (p) => p.getByRole('heading', { level: 1 }).waitFor() },
        { name: 'diagnose-result', path: `/diagnose?${new URLSearchParams({
            'probe.attenuation': '10', 'probe.tipCapacitanceF': '11e-12', 'probe.groundKind': 'clip-lead', 'probe.groundLeadM': '0.15', 'scope.attenuationSetting': '10',
            'scope.bandwidthHz': '500e6', 'circuit.sourceResistanceOhm': '5', 'signal.expectedAmplitudeV': '12', 'signal.frequencyHz': '400000', 'signal.riseTimeS': '3e-9',
            'signal.kind': 'square', 'observed.ringingFrequencyHz': '110e6', 'observed.overshootPct': '66',
          }).toString()}`, ready: (p) => p.getByTestId('hypothesis-ground-lead').first().waitFor() },
        { name: 'review', path: '/review', ready: (p) => p.getByRole('heading', { level: 1 }).waitFor() },
        { name: 'help', path: '/help', ready: (p) => p.locator('.katex-html').first().waitFor() },
        { name: 'help-topic', path: '/help/ground-lead', ready: (p) => p.locator('[data-testid="formula"] .katex-html').first().waitFor() },
      ];
      const found: string[] = [];
      for (const s of screens) {
        await page.goto(`${server.baseUrl}${s.path}`);
        await s.ready(page);
        await page.waitForLoadState('networkidle');
        expect(await page.evaluate(() => document.documentElement.classList.contains('dark'))).toBe(scheme === 'dark');
        await screenshot(page, `axe-${s.name}-${scheme}`);
        for (const v of await seriousViolations(page)) found.push(`${s.name}: ${v}`);
      }
      expect(found).toEqual([]);
      await context.close();
    });
  }
});
