import { readFileSync, writeFileSync } from 'node:fs';
import { captureCsv, captureFile, SPICE_DIR } from '../../server/seed/demo/capture-files';
import { gaussian, mulberry32, seedFrom } from '../../server/seed/demo/prng';
import { DEMO_CAPTURES, type CaptureSpec } from './manifest';
import { interpolate, runNetlist } from './ngspice';

/**
 * Makes the demo casebook's capture files: each case's circuit run as an ngspice transient (or,
 * for aliasing, a closed-form waveform sampled at the scope's too-low rate), scaled to what the
 * channel shows, with seeded noise and the ADC's range. Nothing here calls the diagnosis engine.
 *
 *   npm run demo:captures            # rewrite every file
 *   npm run demo:captures -- --check # only compare with the committed files
 *   npm run demo:captures -- gl-buck-ring   # one case
 */
export function makeCapture(spec: CaptureSpec): { timesS: Float64Array; volts: Float64Array } {
  const points = spec.points ?? 2500;
  const timesS = new Float64Array(points);
  const volts = new Float64Array(points);
  const noise = gaussian(mulberry32(seedFrom(spec.key)));
  let at: (t: number) => number;
  let dt: number;
  if (spec.kind === 'spice') {
    const run = runNetlist(`${SPICE_DIR}${spec.netlist}`);
    dt = (spec.toS - spec.fromS) / (points - 1);
    at = (t) => interpolate(run.timesS, run.volts, spec.fromS + t) * spec.channelSetting;
  } else {
    // the scope's own samples: the waveform read at k / f_s, nothing in between
    dt = 1 / spec.sampleRateHz;
    at = (t) => spec.waveformV(t + spec.fromS);
  }
  const [low, high] = spec.adcRangeV ?? [-Infinity, Infinity];
  for (let i = 0; i < points; i++) {
    timesS[i] = i * dt;
    // the ADC cuts what lies beyond its range, noise and all
    volts[i] = Math.min(high, Math.max(low, at(timesS[i]) + spec.noiseV * noise()));
  }
  return { timesS, volts };
}

function main(args: string[]) {
  const check = args.includes('--check');
  const only = args.filter((a) => !a.startsWith('--'));
  const specs = only.length ? DEMO_CAPTURES.filter((s) => only.includes(s.key)) : DEMO_CAPTURES;
  let changed = 0;
  for (const spec of specs) {
    const csv = captureCsv(makeCapture(spec));
    const file = captureFile(spec.key);
    let old = '';
    try {
      old = readFileSync(file, 'utf8');
    } catch {
      // a new capture
    }
    if (old !== csv) changed++;
    if (!check) writeFileSync(file, csv);
    console.log(`${old === csv ? 'same   ' : check ? 'DIFFERS' : 'written'} ${spec.key}`);
  }
  if (check && changed) {
    console.error(`${changed} capture file(s) differ from what the netlists give`);
    process.exitCode = 1;
  }
}

if (process.argv[1]?.endsWith('generate.ts')) main(process.argv.slice(2));
