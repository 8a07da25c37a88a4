/** The time span on screen, s. */
export interface ViewWindow {
  fromS: number;
  toS: number;
}

/** Windows narrower than this many sample intervals show too little to read. */
const MIN_SAMPLES_IN_VIEW = 8;

/**
 * Keeps a window inside the capture's extent and at least a few samples wide, moving it
 * rather than shrinking it when it runs past an end; null when it covers the whole capture.
 */
export function clampWindow(w: ViewWindow, startS: number, endS: number, sampleIntervalS: number | null): ViewWindow | null {
  const fullS = endS - startS;
  const minS = Math.min(fullS, Math.max((sampleIntervalS ?? 0) * MIN_SAMPLES_IN_VIEW, fullS * 1e-9));
  const spanS = Math.max(minS, w.toS - w.fromS);
  if (spanS >= fullS) return null;
  let fromS = w.fromS;
  if (w.toS - w.fromS < minS) fromS = (w.fromS + w.toS) / 2 - minS / 2;
  fromS = Math.min(Math.max(fromS, startS), endS - spanS);
  return { fromS, toS: fromS + spanS };
}

/** The window zoomed by `factor` (< 1 zooms in) about its centre. */
export function zoomWindow(w: ViewWindow, factor: number): ViewWindow {
  const centreS = (w.fromS + w.toS) / 2;
  const halfS = ((w.toS - w.fromS) * factor) / 2;
  return { fromS: centreS - halfS, toS: centreS + halfS };
}

/** The window moved by `share` of its width (negative: earlier). */
export function panWindow(w: ViewWindow, share: number): ViewWindow {
  const stepS = (w.toS - w.fromS) * share;
  return { fromS: w.fromS + stepS, toS: w.toS + stepS };
}

/** The window scaled by `factor` about the instant `anchorS`, which stays where it is on screen (wheel and pinch). */
export function zoomWindowAt(w: ViewWindow, factor: number, anchorS: number): ViewWindow {
  const at = Math.min(w.toS, Math.max(w.fromS, anchorS));
  return { fromS: at - (at - w.fromS) * factor, toS: at + (w.toS - at) * factor };
}
