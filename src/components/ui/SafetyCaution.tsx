import { SAFETY_CAUTIONS } from '../../../shared/safety/hazard';

/** The red safety caution (DESIGN.md, Safety) with the reasons this case needs it. */
export function SafetyCaution({ reasons }: { reasons: string[] }) {
  return (
    <section role="alert" aria-label="Safety caution" className="rounded-md border-2 border-hazard bg-hazard-soft px-4 py-3 text-sm">
      <p className="font-serif font-bold text-hazard">Safety: hazardous voltage</p>
      {reasons.length > 0 && <p className="mt-1 font-semibold">{reasons.join(' ')}</p>}
      <ul className="mt-2 list-disc space-y-1 pl-5">
        {SAFETY_CAUTIONS.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
    </section>
  );
}
