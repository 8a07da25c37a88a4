import { useMemo } from 'react';
import { diagnosisPlot, type CurveRole } from '../../../../shared/diagnosis/curves';
import type { Cause, DiagnosisInput, Hypothesis } from '../../../../shared/schemas/diagnosis';
import { LineChart, type ChartSeries } from '../../../components/charts/LineChart';
import { AmplitudeBars } from './AmplitudeBars';

const STYLE: Record<CurveRole, ChartSeries['style']> = { observed: 'ink', model: 'model', reference: 'reference' };

const NO_PLOT: Record<Cause, string> = {
  'attenuation-mismatch': 'Record the expected amplitude to compare it with what the scope would show.',
  'termination-mismatch': 'Record the expected amplitude to compare it with what the scope would show.',
  loading: 'An ideal source is not loaded, so there is no response to draw; record the source resistance.',
  bandwidth: 'Record the probe or scope bandwidth to draw the magnitude response.',
  compensation: 'A 1x probe or a 50 Ω input has no compensated divider to draw.',
  'ground-lead': 'No ground lead is connected at the probe, so there is no lead resonance to draw.',
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
