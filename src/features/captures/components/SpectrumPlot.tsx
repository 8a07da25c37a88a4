import { formatEngineering as eng } from '../../../../shared/units/engineering';
import type { StoredAnalysis } from '../stored-analysis';

const W = 320;
const H = 180;
const PAD = { left: 8, right: 8, top: 10, bottom: 28 };

/**
 * The capture's amplitude spectrum (from the stored analysis, FFT by fft.js on the server):
 * a log-frequency axis, amplitude in V, the strongest lines labelled and a hum line in amber.
 */
export function SpectrumPlot({ analysis }: { analysis: StoredAnalysis }) {
  const spectrum = analysis.spectrum;
  if (!spectrum || spectrum.plot.frequenciesHz.length < 2) return <p className="text-sm text-muted">No spectrum: the capture is too short.</p>;
  const { frequenciesHz, amplitudesV } = spectrum.plot;
  const fMin = Math.max(frequenciesHz[0], spectrum.binHz);
  const fMax = spectrum.nyquistHz;
  const aMax = Math.max(...amplitudesV) || 1;
  const x = (f: number) => PAD.left + ((Math.log10(Math.max(f, fMin)) - Math.log10(fMin)) / (Math.log10(fMax) - Math.log10(fMin))) * (W - PAD.left - PAD.right);
  const y = (a: number) => PAD.top + (1 - a / aMax) * (H - PAD.top - PAD.bottom);
  const path = frequenciesHz.map((f, i) => `${i === 0 ? 'M' : 'L'}${x(f).toFixed(1)},${y(amplitudesV[i]).toFixed(1)}`).join(' ');
  const decades: number[] = [];
  for (let d = Math.ceil(Math.log10(fMin)); d <= Math.floor(Math.log10(fMax)); d++) decades.push(10 ** d);
  const hum = analysis.humFrequencyHz;
  const top = spectrum.lines.slice(0, 3);
  return (
    <figure className="flex min-w-0 flex-col gap-1" aria-label="Spectrum of the analysed channel">
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label={`Spectrum: strongest lines ${top.map((l) => `${eng(l.frequencyHz, 'Hz')} (${eng(l.amplitudeV, 'V')})`).join(', ')}${hum ? `; hum at ${eng(hum, 'Hz')}` : ''}.`}>
        {decades.map((f) => (
          <g key={f}>
            <line x1={x(f)} x2={x(f)} y1={PAD.top} y2={H - PAD.bottom} stroke="var(--ft-rule)" strokeWidth="1" />
            <text x={x(f)} y={H - 10} textAnchor="middle" fontSize="10" fill="var(--ft-muted)" fontFamily="IBM Plex Mono, monospace">
              {eng(f, 'Hz', 1)}
            </text>
          </g>
        ))}
        <line x1={PAD.left} x2={W - PAD.right} y1={H - PAD.bottom} y2={H - PAD.bottom} stroke="var(--ft-muted)" strokeWidth="1" />
        {hum !== null && <line x1={x(hum)} x2={x(hum)} y1={PAD.top} y2={H - PAD.bottom} stroke="var(--ft-caution)" strokeWidth="1.5" strokeDasharray="4 3" />}
        <path d={path} fill="none" stroke="var(--ft-ink)" strokeWidth="1.25" />
      </svg>
      <figcaption className="text-xs text-muted">
        Strongest lines:{' '}
        <span className="font-mono">{top.map((l) => `${eng(l.frequencyHz, 'Hz', 3)} ${eng(l.amplitudeV, 'V', 2)}`).join(' · ')}</span>
        {hum !== null ? (
          <>
            {' '}
            · <span className="text-caution">hum at <span className="font-mono">{eng(hum, 'Hz', 3)}</span></span>
          </>
        ) : (
          ' · no mains hum stands out'
        )}
        .
      </figcaption>
    </figure>
  );
}
