/** Pixels of wheel travel that double (or halve) the span shown. */
const WHEEL_PX_PER_DOUBLING = 400;

/**
 * How much one wheel movement scales the span: >1 widens (wheel towards you), <1 narrows.
 * Lines and pages (Firefox, some mice) are turned into pixels first.
 */
export function wheelZoomFactor(deltaY: number, deltaMode = 0): number {
  const px = deltaMode === 1 ? deltaY * 16 : deltaMode === 2 ? deltaY * 400 : deltaY;
  // one flick of a free-spinning wheel must not jump a thousandfold
  const limited = Math.max(-WHEEL_PX_PER_DOUBLING, Math.min(WHEEL_PX_PER_DOUBLING, px));
  return 2 ** (limited / WHEEL_PX_PER_DOUBLING);
}

/**
 * The span [min, max] scaled by `factor` about the point `anchor` of the way across it (0 the
 * left end, 1 the right), so what is under the pointer stays under it. A log axis scales in
 * decades instead of in units.
 */
export function zoomSpan(min: number, max: number, factor: number, anchor: number, log = false): [number, number] {
  const to = log ? Math.log10 : (v: number) => v;
  const from = log ? (v: number) => 10 ** v : (v: number) => v;
  const lo = to(min);
  const hi = to(max);
  const at = lo + (hi - lo) * Math.min(1, Math.max(0, anchor));
  return [from(at - (at - lo) * factor), from(at + (hi - at) * factor)];
}

/** [min, max] kept inside [lowest, highest] without changing its width where it fits; null when it covers it all. */
export function clampSpan(span: [number, number], lowest: number, highest: number, log = false): [number, number] | null {
  const to = log ? Math.log10 : (v: number) => v;
  const from = log ? (v: number) => 10 ** v : (v: number) => v;
  const [lo, hi] = [to(span[0]), to(span[1])];
  const [min, max] = [to(lowest), to(highest)];
  const width = hi - lo;
  if (!(width > 0) || width >= max - min) return null;
  const start = Math.min(Math.max(lo, min), max - width);
  return [from(start), from(start + width)];
}

export interface ZoomHandlers {
  /** Scale the shown span by `factor` about `anchor` (0–1 across the element). */
  onZoom: (factor: number, anchor: number) => void;
  /** Back to the whole extent (a double-click). */
  onReset: () => void;
}

/**
 * Wheel and two-finger pinch zoom and double-click reset on a plot's drawing area. Wheel
 * events within one animation frame are added up, so a fast wheel makes one redraw (and one
 * fetch) per frame, not one per notch. Returns the function that detaches everything.
 */
export function attachZoomGestures(el: HTMLElement, handlers: ZoomHandlers): () => void {
  let pendingFactor = 1;
  let pendingAnchor = 0.5;
  let frame = 0;
  const anchorOf = (clientX: number) => {
    const rect = el.getBoundingClientRect();
    return rect.width > 0 ? (clientX - rect.left) / rect.width : 0.5;
  };
  const flush = () => {
    frame = 0;
    const factor = pendingFactor;
    pendingFactor = 1;
    if (factor !== 1) handlers.onZoom(factor, pendingAnchor);
  };
  const onWheel = (e: WheelEvent) => {
    if (e.deltaY === 0) return;
    e.preventDefault();
    pendingFactor *= wheelZoomFactor(e.deltaY, e.deltaMode);
    pendingAnchor = anchorOf(e.clientX);
    frame ||= requestAnimationFrame(flush);
  };

  const touches = new Map<number, number>();
  let pinchWidth = 0;
  const spread = () => {
    const xs = [...touches.values()];
    return Math.abs(xs[0] - xs[1]);
  };
  const onDown = (e: PointerEvent) => {
    if (e.pointerType !== 'touch') return;
    touches.set(e.pointerId, e.clientX);
    if (touches.size === 2) pinchWidth = spread();
  };
  const onMove = (e: PointerEvent) => {
    if (!touches.has(e.pointerId)) return;
    touches.set(e.pointerId, e.clientX);
    if (touches.size !== 2 || pinchWidth < 10) return;
    const now = spread();
    if (now < 10) return;
    const xs = [...touches.values()];
    pendingFactor *= pinchWidth / now;
    pendingAnchor = anchorOf((xs[0] + xs[1]) / 2);
    pinchWidth = now;
    frame ||= requestAnimationFrame(flush);
  };
  const onUp = (e: PointerEvent) => {
    touches.delete(e.pointerId);
    pinchWidth = 0;
  };
  const onDouble = (e: MouseEvent) => {
    e.preventDefault();
    handlers.onReset();
  };

  el.addEventListener('wheel', onWheel, { passive: false });
  el.addEventListener('pointerdown', onDown);
  el.addEventListener('pointermove', onMove);
  el.addEventListener('pointerup', onUp);
  el.addEventListener('pointercancel', onUp);
  el.addEventListener('dblclick', onDouble);
  return () => {
    if (frame) cancelAnimationFrame(frame);
    el.removeEventListener('wheel', onWheel);
    el.removeEventListener('pointerdown', onDown);
    el.removeEventListener('pointermove', onMove);
    el.removeEventListener('pointerup', onUp);
    el.removeEventListener('pointercancel', onUp);
    el.removeEventListener('dblclick', onDouble);
  };
}
