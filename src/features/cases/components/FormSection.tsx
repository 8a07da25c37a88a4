import { useEffect, useState, type ReactNode } from 'react';

/** One numbered part of the case form, with an anchor for the section links. */
export function FormSection({ id, title, lead, children }: { id: string; title: string; lead?: string; children: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-title`} className="scroll-mt-24 rounded-lg border border-rule bg-sheet p-4 sm:p-5">
      <h2 id={`${id}-title`} className="text-lg">
        {title}
      </h2>
      {lead && <p className="mt-0.5 text-sm text-muted">{lead}</p>}
      <div className="mt-4 flex flex-col gap-4">{children}</div>
    </section>
  );
}

/** A group of related fields inside a section (probe, scope channel, circuit). */
export function FieldGroup({ legend, children }: { legend: string; children: ReactNode }) {
  return (
    <fieldset className="rounded-md border border-rule/80 p-3 sm:p-4">
      <legend className="px-1 font-serif text-sm font-bold">{legend}</legend>
      <div className="grid gap-4 sm:grid-cols-2">{children}</div>
    </fieldset>
  );
}

/**
 * A group the common case can skip: folded until opened, and opened by itself as soon as any
 * of its fields holds a value (a loaded case, a restored draft), so nothing recorded is hidden.
 */
export function CollapsibleGroup({ legend, lead, filled, children }: { legend: string; lead: string; filled: boolean; children: ReactNode }) {
  const [open, setOpen] = useState(filled);
  useEffect(() => {
    if (filled) setOpen(true);
  }, [filled]);
  return (
    <details open={open} onToggle={(e) => setOpen(e.currentTarget.open)} className="group rounded-md border border-rule/80 px-3 py-2 sm:px-4" data-group={legend}>
      <summary className="-mx-1 flex cursor-pointer list-none items-baseline gap-2 px-1 py-1">
        <span aria-hidden className="inline-block w-3 font-mono text-xs text-muted transition-transform group-open:rotate-90">
          ▸
        </span>
        <span className="font-serif text-sm font-bold">{legend}</span>
        <span className="min-w-0 truncate text-xs text-muted">{lead}</span>
      </summary>
      <div className="mt-2 mb-2 grid gap-4 sm:grid-cols-2">{children}</div>
    </details>
  );
}
