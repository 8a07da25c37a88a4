import type { Browser } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { launchBrowser } from './browser';
import { startRealServer, type RunningServer } from './server';

/** One real server (temp DATA_DIR, free port) and one Chromium per suite, stopped after it. */
export function useRealApp(env?: Record<string, string>) {
  const app = {} as { server: RunningServer; browser: Browser };
  beforeAll(async () => {
    [app.server, app.browser] = await Promise.all([startRealServer(env), launchBrowser()]);
  });
  afterAll(async () => {
    await app.browser?.close();
    await app.server?.stop();
  });
  return app;
}
