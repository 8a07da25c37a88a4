import type { CaseSetup } from '../../../../shared/schemas/case';
import type { GeneratorLoad, GroundKind, ProbeKind } from '../../../../shared/schemas/diagnosis';
import { showQuantity, type QuantityUnit } from '../../../lib/quantity';

type Row = [label: string, value: string | null];

const qty = (v: number | null | undefined, unit: QuantityUnit) => (v === null || v === undefined ? null : showQuantity(v, unit));
const text = (v: string | null | undefined) => (v ? v : null);
const yesNo = (v: boolean | null | undefined) => (v === null || v === undefined ? null : v ? 'yes' : 'no');
const GROUND: Record<GroundKind, string> = { 'clip-lead': 'clip lead', spring: 'short spring', none: 'none' };
const PROBE_KIND: Record<ProbeKind, string> = { passive: 'passive', active: 'active', differential: 'differential', current: 'current' };
const GENERATOR: Record<GeneratorLoad, string> = { '50-ohm': 'set for 50 Ω', 'high-z': 'set for high impedance' };
/** Rows whose value is words, not a measured figure (kept out of the mono face). */
const WORDS = new Set(['Model', 'Node', 'Ground', 'Kind', 'Coupling', 'Generator']);

function groups(setup: CaseSetup): { title: string; rows: Row[] }[] {
  const p = setup.probe ?? {};
  const s = setup.scope ?? {};
  const c = setup.circuit ?? {};
  return [
    {
      title: 'Probe',
      rows: [
        ['Model', text(p.model)],
        ['Kind', p.kind ? PROBE_KIND[p.kind] : null],
        ['Nominal attenuation', qty(p.nominalAttenuation, 'x')],
        ['Switchable', p.switchable ? 'yes' : null],
        ['Switch position', p.switchable ? qty(p.attenuation, 'x') : null],
        ['Tip resistance', qty(p.tipResistanceOhm, 'Ω')],
        ['Tip capacitance', qty(p.tipCapacitanceF, 'F')],
        ['Bandwidth', qty(p.bandwidthHz, 'Hz')],
        ['Ground', p.groundKind ? GROUND[p.groundKind] : null],
        ['Ground lead', qty(p.groundLeadM, 'm')],
        ['CMRR', qty(p.cmrrDb, 'dB')],
      ],
    },
    {
      title: 'Scope channel',
      rows: [
        ['Model', text(s.model)],
        ['Attenuation setting', qty(s.attenuationSetting, 'x')],
        ['Input resistance', qty(s.inputResistanceOhm, 'Ω')],
        ['Input capacitance', qty(s.inputCapacitanceF, 'F')],
        ['Bandwidth', qty(s.bandwidthHz, 'Hz')],
        ['Bandwidth limit', s.bandwidthLimitOn ? (qty(s.bandwidthLimitHz, 'Hz') ?? 'on') : null],
        ['Rise time', qty(s.riseTimeS, 's')],
        ['Coupling', s.coupling ? s.coupling.toUpperCase() : null],
        ['AC corner', qty(s.acCornerHz, 'Hz')],
        ['Sample rate', qty(s.sampleRateHz, 'Sa/s')],
        ['Vertical scale', qty(s.voltsPerDiv, 'V/div')],
        ['Offset', qty(s.offsetV, 'V')],
        ['Divisions', qty(s.divisions, '#')],
      ],
    },
    {
      title: 'Circuit',
      rows: [
        ['Source impedance', qty(c.sourceResistanceOhm, 'Ω')],
        ['Node', text(c.nodeDescription)],
        ['Mains-connected', yesNo(c.mainsConnected)],
        ['Highest voltage', qty(c.highestVoltageV, 'V')],
        ['Reference node', qty(c.referenceV, 'V')],
        ['Mains frequency', qty(c.mainsFrequencyHz, 'Hz')],
        ['Load', qty(c.loadResistanceOhm, 'Ω')],
        ['Generator', setup.signal?.generatorLoad ? GENERATOR[setup.signal.generatorLoad] : null],
      ],
    },
  ];
}

/** The recorded setup for reading at a glance: engineering notation in mono, empty rows left out. */
export function SetupCard({ setup }: { setup: CaseSetup }) {
  const filled = groups(setup)
    .map((g) => ({ ...g, rows: g.rows.filter(([, v]) => v !== null) }))
    .filter((g) => g.rows.length > 0);
  if (filled.length === 0) return <p className="text-sm text-muted">No setup recorded.</p>;
  return (
    <div className="flex flex-col gap-3">
      {filled.map((g) => (
        <div key={g.title}>
          <h3 className="mb-1 font-serif text-sm font-bold">{g.title}</h3>
          <dl className="grid grid-cols-[auto_minmax(0,1fr)] text-sm">
            {g.rows.map(([label, value]) => (
              <div key={label} className="contents">
                <dt className="border-t border-rule/60 py-1 pr-3 whitespace-nowrap text-muted">{label}</dt>
                <dd className={`min-w-0 border-t border-rule/60 py-1 text-right break-words ${WORDS.has(label) ? '' : 'font-mono'}`}>{value}</dd>
              </div>
            ))}
          </dl>
        </div>
      ))}
    </div>
  );
}
