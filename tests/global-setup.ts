import { buildClientIfStale } from '../scripts/build-client';

// e2e suites serve the built client; build it once before any suite starts a server
export default function setup() {
  buildClientIfStale();
}
