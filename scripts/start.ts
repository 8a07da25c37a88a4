import { buildClientIfStale } from './build-client';

buildClientIfStale();
await import('../server/index');
