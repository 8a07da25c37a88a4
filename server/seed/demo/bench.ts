/**
 * The invented instruments of Quillfen's test bay, as the team writes them into cases. Asset
 * numbers are the company's own; no real make or model is meant.
 */
export const SCOPES = {
  /** 1 GHz lab scope in the signal-integrity corner, 1 MΩ or 50 Ω inputs. */
  sc01: { model: 'SC-01 lab scope, 1 GHz, 4 ch', bandwidthHz: 1e9, inputResistanceOhm: 1e6, inputCapacitanceF: 14e-12 },
  /** 200 MHz bench scope on bench 2. */
  sc02: { model: 'SC-02 bench scope, 200 MHz, 4 ch', bandwidthHz: 200e6, inputResistanceOhm: 1e6, inputCapacitanceF: 16e-12 },
  /** The old 100 MHz two-channel scope everyone calls "scope B". */
  sc03: { model: 'SC-03 "scope B", 100 MHz, 2 ch', bandwidthHz: 100e6, inputResistanceOhm: 1e6, inputCapacitanceF: 20e-12 },
  /** 500 MHz scope on the power bench, with a 20 MHz limit filter per channel. */
  sc04: { model: 'SC-04 power-bench scope, 500 MHz, 4 ch', bandwidthHz: 500e6, inputResistanceOhm: 1e6, inputCapacitanceF: 15e-12 },
} as const;

export const PROBES = {
  /** 10x passive, 500 MHz, 11 pF, with the 15 cm clip lead from the kit. */
  p03: { model: 'P-03 10x passive, 500 MHz', attenuation: 10, nominalAttenuation: 10, tipCapacitanceF: 11e-12, bandwidthHz: 500e6 },
  /** Switchable 1x/10x passive from a scope kit; the scope cannot see the switch. */
  p17: { model: 'P-17 switchable 1x/10x', nominalAttenuation: 10, switchable: true },
  /** 100x high-voltage passive, rated for the mains bench. */
  p22: { model: 'P-22 100x high-voltage passive, 300 MHz', attenuation: 100, nominalAttenuation: 100, tipCapacitanceF: 7e-12, bandwidthHz: 300e6 },
} as const;

/** A fixed time in 2026, UTC: `t('05-19 10:05')`. The demo never depends on the clock. */
export const t = (monthDayTime: string) => new Date(`2026-${monthDayTime.replace(' ', 'T')}:00.000Z`).toISOString();
