/** Capture and model on one ascending x axis, as uPlot wants them: null where a series has no value. */
export interface CapturePlotData {
  x: number[];
  capture: (number | null)[];
  model: (number | null)[];
  /** Further traces on the same time axis (the capture's other channels, or the capture before the fix). */
  others: (number | null)[][];
}

/** Linear interpolation of an ascending curve at t; null outside its span. */
function interpolator(timesS: readonly number[], volts: readonly number[]) {
  let i = 1;
  return (t: number): number | null => {
    if (timesS.length === 0 || t < timesS[0] || t > timesS[timesS.length - 1]) return null;
    if (timesS.length === 1) return volts[0];
    // callers ask in ascending order, so the search only moves forward
    if (t < timesS[i - 1]) i = 1;
    while (i < timesS.length - 1 && timesS[i] < t) i++;
    const t0 = timesS[i - 1];
    const t1 = timesS[i];
    return t1 === t0 ? volts[i] : volts[i - 1] + ((t - t0) / (t1 - t0)) * (volts[i] - volts[i - 1]);
  };
}

/**
 * Merges the (decimated) capture samples with the model's own points inside [fromS, toS], so
 * the model keeps its shape when only a few capture samples are in view, and evaluates the
 * model at every x, so it also follows the capture's resolution.
 */
export function mergePlotData(
  trace: { timesS: readonly number[]; volts: readonly number[] },
  overlay: { timesS: readonly number[]; volts: readonly number[] } | null,
  fromS: number,
  toS: number,
): CapturePlotData {
  const modelTimes = overlay ? overlay.timesS.filter((t) => t >= fromS && t <= toS) : [];
  const x: number[] = [];
  const capture: (number | null)[] = [];
  let i = 0;
  let j = 0;
  while (i < trace.timesS.length || j < modelTimes.length) {
    const tc = i < trace.timesS.length ? trace.timesS[i] : Infinity;
    const tm = j < modelTimes.length ? modelTimes[j] : Infinity;
    if (tc <= tm) {
      x.push(tc);
      capture.push(trace.volts[i]);
      i++;
      if (tm === tc) j++;
    } else {
      x.push(tm);
      capture.push(null);
      j++;
    }
  }
  const modelAt = overlay ? interpolator(overlay.timesS, overlay.volts) : () => null;
  return { x, capture, model: x.map((t) => modelAt(t)), others: [] };
}

/**
 * Adds further traces on the same axis: their samples are merged into x (each trace null where
 * it has no sample of its own, drawn across the gap), so min/max columns keep their peaks.
 */
export function withOtherTraces(base: CapturePlotData, traces: { timesS: readonly number[]; volts: readonly number[] }[], fromS: number, toS: number): CapturePlotData {
  if (traces.length === 0) return base;
  const points = new Map<number, { capture: number | null; model: number | null; others: (number | null)[] }>();
  base.x.forEach((t, i) => points.set(t, { capture: base.capture[i], model: base.model[i], others: traces.map(() => null) }));
  traces.forEach((trace, k) => {
    trace.timesS.forEach((t, i) => {
      if (t < fromS || t > toS) return;
      const at = points.get(t) ?? { capture: null, model: null, others: traces.map(() => null) };
      at.others[k] = trace.volts[i];
      points.set(t, at);
    });
  });
  const x = [...points.keys()].sort((a, b) => a - b);
  return {
    x,
    capture: x.map((t) => points.get(t)!.capture),
    model: x.map((t) => points.get(t)!.model),
    others: traces.map((_, k) => x.map((t) => points.get(t)!.others[k])),
  };
}

/** Value of the capture at t, interpolated between the samples on either side. */
export function captureValueAt(trace: { timesS: readonly number[]; volts: readonly number[] }, t: number): number | null {
  return interpolator(trace.timesS, trace.volts)(t);
}
