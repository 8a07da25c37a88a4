import type { ReactNode } from 'react';

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
