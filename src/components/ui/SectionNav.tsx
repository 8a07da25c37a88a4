/** In-page links to a long page's sections (no tabs: every section stays on the page). */
export function SectionNav({ label, sections }: { label: string; sections: { id: string; title: string }[] }) {
  return (
    <nav aria-label={label} className="-mx-1 overflow-x-auto">
      <ul className="flex gap-1 px-1 text-sm whitespace-nowrap">
        {sections.map((s) => (
          <li key={s.id}>
            <a href={`#${s.id}`} className="block rounded-md px-2.5 py-1 text-muted hover:bg-rule/50 hover:text-ink">
              {s.title}
            </a>
          </li>
        ))}
      </ul>
    </nav>
  );
}
