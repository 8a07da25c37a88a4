import { existsSync } from 'node:fs';
import path from 'node:path';
import { captureWorkers } from './capture-pool';
import { plotStoreDirFor } from './capture-store';
import { openStore, type OpenStore } from './sample-store';

type Built = { ok: true } | { ok: false; message: string };

/**
 * The compact samples of stored captures, for plots: kept on disk beside each capture file
 * (written at upload; for a capture stored before that, built from its CSV on first use), so
 * zooming and panning a plot reads the binary samples instead of re-parsing the CSV, and
 * memory does not grow with the captures. Two requests for a store still being built share
 * one build, which runs on the capture worker.
 */
export function createPlotStores() {
  const building = new Map<string, Promise<Built>>();
  let builds = 0;

  // on the capture worker: a first view of a large capture does not stall other requests
  const build = (file: string, dir: string): Promise<Built> => {
    builds++;
    return captureWorkers.buildPlotStore(file, dir);
  };

  return {
    /** The plot store of a capture file, opened; the caller closes it. */
    async open(file: string): Promise<{ ok: true; store: OpenStore } | { ok: false; message: string }> {
      const dir = plotStoreDirFor(file);
      if (!existsSync(path.join(dir, 'meta.json'))) {
        let pending = building.get(file);
        if (!pending) {
          pending = build(file, dir).finally(() => building.delete(file));
          building.set(file, pending);
        }
        const built = await pending;
        if (!built.ok) return built;
      }
      return { ok: true, store: openStore(dir) };
    },
    stats: () => ({ builds, building: building.size }),
  };
}

export type PlotStores = ReturnType<typeof createPlotStores>;
