import { NavLink } from 'react-router-dom';
import { HELP_TOPICS } from '../topics/help-topics';

/** The list of Help pages beside each page. */
export function HelpTopicNav() {
  return (
    <nav aria-label="Help topics" className="text-sm">
      <p className="mb-2 text-xs font-semibold uppercase tracking-wide text-muted">Help topics</p>
      <ul className="flex flex-col gap-0.5">
        <li>
          <NavLink to="/help" end className={({ isActive }) => `block rounded-md px-2 py-1 ${isActive ? 'bg-ink text-paper' : 'hover:bg-rule/50'}`}>
            All topics
          </NavLink>
        </li>
        {HELP_TOPICS.map((t) => (
          <li key={t.slug}>
            <NavLink
              to={`/help/${t.slug}`}
              className={({ isActive }) => `block rounded-md px-2 py-1 ${isActive ? 'bg-ink text-paper' : t.slug === 'safety' ? 'text-hazard hover:bg-hazard-soft' : 'hover:bg-rule/50'}`}
            >
              {t.title}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
