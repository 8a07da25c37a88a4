/**
 * Ranges an inferred value must stay within to be physically plausible on a bench (our
 * bounds, from common practice). A model clamps what it infers to these and says so, so a
 * 21 Hz "ringing" never turns into a megahenry lead that fits.
 */
export const PLAUSIBLE = {
  /** A ground return, from a spring (a few mm) to the longest clip lead anyone uses. */
  leadLengthM: { min: 0.003, max: 1 },
  /** Thevenin resistance of a node: a stiff rail up to an electrometer-grade source. */
  sourceResistanceOhm: { min: 0, max: 100e6 },
  /** Capacitance at a passive probe's tip or across its tip resistor. */
  tipCapacitanceF: { min: 0.5e-12, max: 1e-9 },
  /** A probe or channel ratio. */
  attenuation: { min: 1, max: 1000 },
  /**
   * A trimmer error, jump/settle − 1: trimmers cover inputs of roughly 10–25 pF, so a probe
   * out of adjustment is off by a few to a few tens of %, not by a factor.
   */
  compensationError: { min: -0.25, max: 0.25 },
  /** An effective measurement bandwidth: audio probes up to the fastest sampling heads. */
  bandwidthHz: { min: 1e3, max: 100e9 },
} as const;

export type PlausibleQuantity = keyof typeof PLAUSIBLE;

/** The value held inside its plausible range, and whether it had to be moved. */
export function clampPlausible(quantity: PlausibleQuantity, value: number): { value: number; clamped: boolean } {
  const { min, max } = PLAUSIBLE[quantity];
  if (!Number.isFinite(value)) return { value: value > 0 ? max : min, clamped: true };
  const held = Math.min(max, Math.max(min, value));
  return { value: held, clamped: held !== value };
}

/** Whether a value lies inside its plausible range. */
export const isPlausible = (quantity: PlausibleQuantity, value: number): boolean =>
  Number.isFinite(value) && value >= PLAUSIBLE[quantity].min && value <= PLAUSIBLE[quantity].max;
