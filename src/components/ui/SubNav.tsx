import { NavLink } from 'react-router-dom';

/** Links between the pages of one area (e.g. the review queue and tag curation). */
export function SubNav({ label, items }: { label: string; items: { to: string; label: string; end?: boolean }[] }) {
  return (
    <nav aria-label={label} className="mb-6">
      <ul className="flex flex-wrap gap-1 border-b border-rule text-sm">
        {items.map((i) => (
          <li key={i.to}>
            <NavLink
              to={i.to}
              end={i.end}
              className={({ isActive }) =>
                `-mb-px block rounded-t-md border border-b-0 px-3 py-1.5 font-semibold ${isActive ? 'border-rule bg-sheet text-ink' : 'border-transparent text-muted hover:text-ink'}`
              }
            >
              {i.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
