import { useMemo } from 'react';
import { diagnosisPlot, type CurveRole } from '../../../../shared/diagnosis/curves';
import type { DiagnosisInput, Hypothesis, HypothesisCause } from '../../../../shared/schemas/diagnosis';
import { LineChart, type ChartSeries } from '../../../components/charts/LineChart';
import { AmplitudeBars } from './AmplitudeBars';

const STYLE: Record<CurveRole, ChartSeries['style']> = { observed: 'ink', model: 'model', reference: 'reference' };

const NO_PLOT: Record<HypothesisCause, string> = {
  'attenuation-mismatch': 'Record the expected amplitude to compare it with what the scope would show.',
  'termination-mismatch': 'Record the expected amplitude to compare it with what the scope would show.',
  loading: 'An ideal source is not loaded, so there is no response to draw; record the source resistance.',
  bandwidth: 'Record the probe or scope bandwidth to draw the magnitude response.',
  compensation: 'A 1x probe or a 50 Ω input has no compensated divider to draw.',
  'ground-lead': 'No ground lead is connected at the probe, so there is no lead resonance to draw.',
  aliasing: 'Record the signal frequency and the sample rate to draw where the alias lands.',
  clipping: 'Record the vertical scale and offset to draw the screen window over the signal.',
  'ac-coupling': 'The channel is DC-coupled as recorded; with AC coupling (or observed droop) the drooping square is drawn.',
  'common-mode': "A single-ended probe grounded away from earth is a hazard, not a measurement; with a differential probe, record the reference node's voltage to draw the common-mode share.",
  'mains-pickup': 'Hum is a line at the mains frequency or one of its harmonics; the explanation names which.',
  'generator-load': "Record the generator's load setting and what it drives to draw the divider.",
  faithful: 'The recorded setup explains the trace; there is no error to draw.',
};

/** The picture behind one hypothesis, or a line saying there is none for this setup. */
export function HypothesisPlot({ input, hypothesis }: { input: DiagnosisInput; hypothesis: Hypothesis }) {
  const plot = useMemo(() => diagnosisPlot(input, hypothesis.cause, hypothesis), [input, hypothesis]);
  const series = useMemo(
    () => (plot?.kind === 'line' ? plot.series.map((s) => ({ label: s.label, values: s.values, style: STYLE[s.role] })) : []),
    [plot],
  );
  if (!plot) return <p className="text-sm text-muted">No plot: {NO_PLOT[hypothesis.cause]}</p>;
  if (plot.kind === 'bars') return <AmplitudeBars plot={plot} />;
  return (
    <LineChart
      title={plot.title}
      summary={plot.summary}
      x={plot.x}
      series={series}
      xUnit={plot.xUnit}
      yUnit={plot.yUnit}
      xLabel={plot.xLabel}
      yLabel={plot.yLabel}
      logX={plot.logX}
      yFromZero={plot.logX}
    />
  );
}
