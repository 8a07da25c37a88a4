import { afterEach } from 'vitest';
import { reportOpenPages } from './helpers/browser';

// a browser test that fails says where each of its pages stood, even when it timed out
afterEach(async ({ task }) => {
  if (task.result?.state === 'fail') await reportOpenPages(task.name.replace(/[^a-z0-9]+/gi, '-').slice(0, 60));
});
