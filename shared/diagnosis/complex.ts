/** A complex number as plain data, so impedances can cross JSON and test boundaries. */
export interface Complex {
  re: number;
  im: number;
}

export const complex = (re: number, im = 0): Complex => ({ re, im });

export const add = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });

export const multiply = (a: Complex, b: Complex): Complex => ({
  re: a.re * b.re - a.im * b.im,
  im: a.re * b.im + a.im * b.re,
});

export function divide(a: Complex, b: Complex): Complex {
  const denominator = b.re * b.re + b.im * b.im;
  return {
    re: (a.re * b.re + a.im * b.im) / denominator,
    im: (a.im * b.re - a.re * b.im) / denominator,
  };
}

export const magnitude = (a: Complex): number => Math.hypot(a.re, a.im);

/** Two impedances in parallel, Z1·Z2/(Z1+Z2), in Ω. */
export const parallel = (a: Complex, b: Complex): Complex => divide(multiply(a, b), add(a, b));

/** Impedance of an ideal capacitor, 1/(jωC), in Ω; `frequencyHz` must be > 0. */
export const capacitorImpedance = (capacitanceF: number, frequencyHz: number): Complex => ({
  re: 0,
  im: -1 / (2 * Math.PI * frequencyHz * capacitanceF),
});

/** A resistor R in parallel with a capacitor C at a frequency, R/(1 + jωRC) (R alone at DC), in Ω. */
export function resistorParallelCapacitor(
  resistanceOhm: number,
  capacitanceF: number,
  frequencyHz: number,
): Complex {
  if (frequencyHz <= 0 || capacitanceF <= 0) return complex(resistanceOhm);
  // R/(1 + jωRC) stays finite for any ω, where 1/(jωC) overflows as ω → 0.
  const x = 2 * Math.PI * frequencyHz * resistanceOhm * capacitanceF;
  const denominator = 1 + x * x;
  return { re: resistanceOhm / denominator, im: (-resistanceOhm * x) / denominator };
}
