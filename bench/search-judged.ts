import type { SearchSourceRow } from '../server/db/repositories/search-source';

/**
 * A judged relevance set, written apart from the demo casebook: an invented test bench at a
 * maker of irrigation pump controllers. Each query lists the titles of the cases that answer
 * it; the cases are mixed into the generated corpus (as distractors around them) and the
 * benchmark reports nDCG@5 for the app's search and for plain FTS5 BM25.
 */
interface JudgedCase {
  title: string;
  summary: string;
  narrative: string;
  cause: string | null;
  tags: string[];
  fix?: string;
}

export const JUDGED_CASES: JudgedCase[] = [
  { title: 'Pump stator current sense reads a tenth', summary: 'The shunt amplifier output looked ten times too small on the bench scope.', narrative: 'The probe was switched to x10 but the channel was still set for a x1 probe, so every reading of the stator current came out a tenth of the real value.', cause: 'attenuation-mismatch', tags: ['10x-at-1x', 'current-sense'] },
  { title: 'Valve solenoid flyback spike looked tiny', summary: 'The flyback clamp seemed to do nothing wrong, the spike was a few volts.', narrative: 'The solenoid spike is normally forty volts. The channel had been left at 1x after the last user, with a switchable probe at 10x.', cause: 'attenuation-mismatch', tags: ['switchable-probe', 'solenoid'] },
  { title: 'Moisture sensor excitation almost flat on the scope', summary: 'A 5 V excitation square showed as a few millivolts.', narrative: 'The channel input had been set to 50 ohm for a cable measurement the day before. A passive probe into a 50 ohm input loads everything to nothing.', cause: 'termination-mismatch', tags: ['50-ohm-input', 'moisture-sensor'] },
  { title: 'Float switch pull-up sags when probed', summary: 'The float switch input drops from 3.3 V whenever the probe touches it.', narrative: 'The pull-up is 470 kilohm to save power in the field. The 1x probe and its cable capacitance pulled the node down; a 10x probe left it alone.', cause: 'loading', tags: ['high-impedance-node', 'float-switch'] },
  { title: 'Reference divider for the pressure transducer reads low', summary: 'The midpoint of a megohm divider read 20 percent low.', narrative: 'With a 1 megohm probe across the lower leg, the divider ratio changed. The pressure readings were fine; the measurement was not.', cause: 'loading', tags: ['rc-loading', 'pressure-transducer'] },
  { title: 'Gate driver edges rounded on the motor inverter', summary: 'The low-side gate edges looked slow, like 40 ns instead of 8.', narrative: 'The bandwidth limit filter was on from a ripple measurement. With 20 MHz limit off the gate rise was as fast as the driver datasheet says.', cause: 'bandwidth', tags: ['bandwidth-limit-filter', 'gate-driver'] },
  { title: 'RS-485 line to the valve box looked sluggish', summary: 'Bit edges on the RS-485 pair rose slowly on the shop scope.', narrative: 'The shop scope is a 50 MHz model with a 1x probe. The transceiver edges were fine on the faster scope in the lab.', cause: 'bandwidth', tags: ['slow-edges', 'rs485'] },
  { title: 'Hall sensor square wave with spikes on the corners', summary: 'Every corner of the Hall sensor output had a sharp overshoot.', narrative: 'The probe had moved from another scope without compensation. Adjusting the trimmer on the calibrator square made the corners square again.', cause: 'compensation', tags: ['probe-compensation', 'hall-sensor'] },
  { title: 'Tachometer pulses with rounded corners', summary: 'The pump tachometer pulses looked rounded at the leading corner.', narrative: 'Under-compensated probe: the trimmer was turned too far. On the calibrator output the same rounding showed, so it was the probe and not the tach.', cause: 'compensation', tags: ['probe-compensation', 'tachometer'] },
  { title: 'Motor phase node rang at 140 MHz after every edge', summary: 'The switch node rang hard after each transition of the half bridge.', narrative: 'A 15 cm ground clip lead formed a loop with the probe tip capacitance. A ground spring at the tip removed most of the ringing.', cause: 'ground-lead', tags: ['long-ground-lead', 'ground-spring', 'ringing'] },
  { title: 'Buck converter output ringing that was not there', summary: 'The 12 V buck output seemed to ring on each switching edge.', narrative: 'With the clip lead replaced by the spring tip the ringing was gone. The regulator was fine; the ground loop of the probe rang.', cause: 'ground-lead', tags: ['ground-spring', 'buck-converter'] },
  { title: 'Piezo buzzer driver hash on each transition', summary: 'A burst of high frequency hash rode on every edge of the buzzer drive.', narrative: 'The alarm buzzer in the controller is driven by a small push-pull stage. Using the tip-and-barrel method made the hash disappear.', cause: 'ground-lead', tags: ['buzzer'] },
  { title: 'Flow meter pulses aliased into a slow wobble', summary: 'The flow meter output looked like a 300 Hz wobble instead of a 2 MHz pulse train.', narrative: 'The timebase was long and the sample rate had dropped far below the signal. Shortening the timebase showed the real pulses.', cause: 'aliasing', tags: ['sample-rate', 'flow-meter'] },
  { title: 'Mains hum on the soil probe signal', summary: 'A 50 Hz ripple sat on the millivolt soil sensor trace.', narrative: 'The long unshielded leads to the field sensor picked up mains hum from the pump motor cable. A twisted pair and the scope on battery showed it clean.', cause: 'mains-pickup', tags: ['mains-hum', 'soil-sensor'] },
  { title: 'Pump inrush clipped flat at the top', summary: 'The inrush current waveform had a flat top at exactly eight divisions.', narrative: 'The channel was overdriven: the vertical scale put the peak off screen and the front end clipped it. At a larger volts per division the peak was rounded as expected.', cause: 'clipping', tags: ['overdrive', 'inrush'] },
  { title: 'Controller 24 V rail droops on slow square test', summary: 'A 20 Hz square on the 24 V enable line tilted between edges.', narrative: 'AC coupling was on from the ripple measurement. In DC coupling the enable line was flat.', cause: 'ac-coupling', tags: ['ac-coupling', 'enable-line'] },
  { title: 'Isolated gate drive floating measurement showed garbage', summary: 'Measuring the high side gate with a ground clip on the switch node gave a mess.', narrative: 'The high-side reference swings with the phase node; a passive probe referenced to earth sees the common mode. A differential probe showed a clean gate. Safety: the switch node is at mains potential.', cause: 'common-mode', tags: ['differential-probe', 'high-side'] },
  { title: 'Function generator gave double the amplitude into the valve driver', summary: 'The generator was set to 2 V but the driver input saw 4 V.', narrative: 'The generator assumes a 50 ohm load; into the high impedance driver input the amplitude doubled. Setting the generator load to high-Z fixed the reading.', cause: 'generator-load', tags: ['generator-load'] },
  { title: 'Watchdog reset line fell slowly, or so it seemed', summary: 'The supervisor reset output fell over 200 ns.', narrative: 'A 1x probe has only a few MHz of bandwidth. At 10x the fall was 15 ns, as the supervisor datasheet promises.', cause: 'bandwidth', tags: ['1x-probe-bandwidth', 'watchdog'] },
  { title: 'Encoder signal rose in steps on the slow scope', summary: 'The quadrature encoder edges rose in two steps.', narrative: 'The cable to the encoder was unterminated, a real reflection, not the probe. A series resistor at the driver fixed it.', cause: null, tags: ['reflection', 'encoder'] },
  { title: 'Level sensor comparator output chattered', summary: 'The comparator for the tank level chattered at the threshold.', narrative: 'Real chatter: the comparator had no hysteresis. Adding a few millivolts of hysteresis cured it. The trace was true.', cause: 'faithful', tags: ['comparator', 'level-sensor'] },
  { title: 'Relay contact bounce was real', summary: 'The pump relay contacts bounced for 3 ms on closing.', narrative: 'Bounce on a mechanical relay is normal. The scope showed what happened; the firmware needed a debounce.', cause: 'faithful', tags: ['relay', 'bounce'] },
];

export interface JudgedQuery {
  q: string;
  /** Titles of the cases that answer it. */
  relevant: string[];
}

export const JUDGED_QUERIES: JudgedQuery[] = [
  { q: 'stator current ten times too small ', relevant: ['Pump stator current sense reads a tenth'] },
  { q: 'flyback spike much smaller than expected ', relevant: ['Valve solenoid flyback spike looked tiny', 'Pump stator current sense reads a tenth'] },
  { q: 'excitation square only millivolts ', relevant: ['Moisture sensor excitation almost flat on the scope'] },
  { q: 'pull-up voltage drops when I touch it with the probe ', relevant: ['Float switch pull-up sags when probed', 'Reference divider for the pressure transducer reads low'] },
  { q: 'megohm divider reads low ', relevant: ['Reference divider for the pressure transducer reads low', 'Float switch pull-up sags when probed'] },
  { q: 'gate rise slower than the datasheet ', relevant: ['Gate driver edges rounded on the motor inverter', 'Watchdog reset line fell slowly, or so it seemed'] },
  { q: 'rs485 edges slow on shop scope ', relevant: ['RS-485 line to the valve box looked sluggish'] },
  { q: 'overshoot on hall sensor corners ', relevant: ['Hall sensor square wave with spikes on the corners'] },
  { q: 'tach pulses rounded corner ', relevant: ['Tachometer pulses with rounded corners'] },
  { q: 'switch node rang after each edge ', relevant: ['Motor phase node rang at 140 MHz after every edge', 'Buck converter output ringing that was not there'] },
  { q: 'buck regulator ringing clip lead ', relevant: ['Buck converter output ringing that was not there', 'Motor phase node rang at 140 MHz after every edge'] },
  { q: 'buzzer drive hash ', relevant: ['Piezo buzzer driver hash on each transition'] },
  { q: 'flow pulses show as slow wobble ', relevant: ['Flow meter pulses aliased into a slow wobble'] },
  { q: '50 Hz on sensor leads from pump motor ', relevant: ['Mains hum on the soil probe signal'] },
  { q: 'inrush peak flat top clipped ', relevant: ['Pump inrush clipped flat at the top'] },
  { q: 'square tilts between edges 24 V ', relevant: ['Controller 24 V rail droops on slow square test'] },
  { q: 'high side gate measurement mess ', relevant: ['Isolated gate drive floating measurement showed garbage'] },
  { q: 'generator amplitude doubled ', relevant: ['Function generator gave double the amplitude into the valve driver'] },
  { q: 'supervisor reset fall time 200 ns ', relevant: ['Watchdog reset line fell slowly, or so it seemed'] },
  { q: 'encoder edges rise in two steps ', relevant: ['Encoder signal rose in steps on the slow scope'] },
  { q: 'comparator chatters at threshold ', relevant: ['Level sensor comparator output chattered'] },
  { q: 'relay contacts bounced ', relevant: ['Relay contact bounce was real'] },
];

/** The judged cases as rows after `after`, verified, so the app and FTS5 index them like the rest. */
export function judgedRows(after: number): { rows: SearchSourceRow[]; tags: Map<number, string[]> } {
  const tags = new Map<number, string[]>();
  const rows = JUDGED_CASES.map((c, i): SearchSourceRow => {
    const id = after + i + 1;
    tags.set(id, c.tags);
    return {
      id, author_id: 1, status: 'verified', title: c.title, summary: c.summary, narrative: c.narrative, setup: '{}',
      stated_cause: c.cause, stated_cause_other: null, cause: c.cause === 'faithful' ? null : c.cause, engine_cause: null,
      fix: c.fix ?? null, lesson_summary: null, lesson_detail: null, updated_at: '2026-06-01T00:00:00.000Z',
    };
  });
  return { rows, tags };
}

/** nDCG@k with binary gains. source: Järvelin & Kekäläinen, "Cumulated gain-based evaluation of IR techniques", ACM TOIS 20(4), 2002 */
export function ndcgAt(k: number, ranked: string[], relevant: string[]): number {
  const rel = new Set(relevant);
  let dcg = 0;
  ranked.slice(0, k).forEach((t, i) => {
    if (rel.has(t)) dcg += 1 / Math.log2(i + 2);
  });
  let ideal = 0;
  for (let i = 0; i < Math.min(k, rel.size); i++) ideal += 1 / Math.log2(i + 2);
  return ideal === 0 ? 0 : dcg / ideal;
}
