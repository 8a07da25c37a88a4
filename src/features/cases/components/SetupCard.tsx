import type { CaseSetup } from '../../../../shared/schemas/case';
import type { GroundKind } from '../../../../shared/schemas/diagnosis';
import { showQuantity, type QuantityUnit } from '../../../lib/quantity';

type Row = [label: string, value: string | null];

const qty = (v: number | null | undefined, unit: QuantityUnit) => (v === null || v === undefined ? null : showQuantity(v, unit));
const text = (v: string | null | undefined) => (v ? v : null);
const yesNo = (v: boolean | null | undefined) => (v === null || v === undefined ? null : v ? 'yes' : 'no');
const GROUND: Record<GroundKind, string> = { 'clip-lead': 'clip lead', spring: 'short spring', none: 'none' };

function groups(setup: CaseSetup): { title: string; rows: Row[] }[] {
  const p = setup.probe ?? {};
  const s = setup.scope ?? {};
  const c = setup.circuit ?? {};
  return [
    {
      title: 'Probe',
      rows: [
        ['Model', text(p.model)],
        ['Nominal attenuation', qty(p.nominalAttenuation, 'x')],
        ['Switchable', p.switchable ? 'yes' : null],
        ['Switch position', p.switchable ? qty(p.attenuation, 'x') : null],
        ['Tip resistance', qty(p.tipResistanceOhm, 'Ω')],
        ['Tip capacitance', qty(p.tipCapacitanceF, 'F')],
        ['Bandwidth', qty(p.bandwidthHz, 'Hz')],
        ['Ground', p.groundKind ? GROUND[p.groundKind] : null],
        ['Ground lead', qty(p.groundLeadM, 'm')],
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
      ],
    },
    {
      title: 'Circuit',
      rows: [
        ['Source impedance', qty(c.sourceResistanceOhm, 'Ω')],
        ['Node', text(c.nodeDescription)],
        ['Mains-connected', yesNo(c.mainsConnected)],
        ['Highest voltage', qty(c.highestVoltageV, 'V')],
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
                <dd className={`min-w-0 border-t border-rule/60 py-1 text-right break-words ${label === 'Model' || label === 'Node' || label === 'Ground' ? '' : 'font-mono'}`}>{value}</dd>
              </div>
            ))}
          </dl>
        </div>
      ))}
    </div>
  );
}
