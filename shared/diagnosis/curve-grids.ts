/**
 * Evenly spaced times for a step response: a short lead-in before the edge so the step is
 * visible, t = 0 exactly on a sample, then `spanS` after it. In s.
 */
export function stepGrid(spanS: number, points = 600): number[] {
  const dt = spanS / points;
  const lead = Math.round(points * 0.08);
  return Array.from({ length: points + lead + 1 }, (_, i) => (i - lead) * dt);
}

/** `points` values from `low` to `high` in equal ratios (even steps on a log axis). */
export function geometricGrid(low: number, high: number, points: number): number[] {
  const ratio = Math.log(high / low) / (points - 1);
  return Array.from({ length: points }, (_, i) => low * Math.exp(ratio * i));
}

/**
 * Response to a linear ramp from 0 to 1 over `rampS`, from the unit-step response sampled on
 * the ascending times `timesS` (zero before the first sample): for a linear time-invariant
 * system the ramp is the step averaged over its length, y(t) = (S(t) − S(t − T))/T with
 * S the running integral of the step response (trapezoid rule here).
 * source: superposition/convolution for linear time-invariant systems.
 */
export function rampResponse(timesS: readonly number[], stepValues: readonly number[], rampS: number): number[] {
  const integral = [0];
  for (let i = 1; i < timesS.length; i++) {
    integral.push(integral[i - 1] + ((stepValues[i] + stepValues[i - 1]) / 2) * (timesS[i] - timesS[i - 1]));
  }
  const integralAt = (t: number): number => {
    if (t <= timesS[0]) return 0;
    let lo = 0;
    let hi = timesS.length - 1;
    if (t >= timesS[hi]) return integral[hi];
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (timesS[mid] <= t) lo = mid;
      else hi = mid;
    }
    const f = (t - timesS[lo]) / (timesS[hi] - timesS[lo]);
    return integral[lo] + f * (integral[hi] - integral[lo]);
  };
  return timesS.map((t, i) => (integral[i] - integralAt(t - rampS)) / rampS);
}
