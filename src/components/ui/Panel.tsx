import type { ReactNode } from 'react';

export function Panel({ title, actions, children, className = '' }: { title?: ReactNode; actions?: ReactNode; children: ReactNode; className?: string }) {
  return (
    <section className={`rounded-lg border border-rule bg-sheet p-5 shadow-[0_1px_0_var(--ft-rule)] ${className}`}>
      {(title || actions) && (
        <header className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
          {title && <h2 className="text-lg">{title}</h2>}
          {actions}
        </header>
      )}
      {children}
    </section>
  );
}

export function PageHeader({ title, lead, actions }: { title: string; lead?: ReactNode; actions?: ReactNode }) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-rule pb-4">
      <div>
        <h1 className="text-2xl sm:text-3xl">{title}</h1>
        {lead && <p className="mt-1 max-w-2xl text-muted">{lead}</p>}
      </div>
      {actions}
    </div>
  );
}

export function Loading({ what = 'Loading' }: { what?: string }) {
  return (
    <p role="status" className="flex items-center gap-2 py-8 text-muted">
      <span className="h-4 w-4 animate-spin rounded-full border-2 border-current border-t-transparent" aria-hidden />
      {what}…
    </p>
  );
}

/** An honest placeholder for a screen whose issue has not landed yet. */
export function NotBuiltPanel({ screen, what }: { screen: string; what: string }) {
  return (
    <Panel>
      <p className="font-serif text-lg">{screen} is not built yet.</p>
      <p className="mt-2 max-w-2xl text-muted">{what}</p>
    </Panel>
  );
}

export function Badge({ children, tone = 'plain' }: { children: ReactNode; tone?: 'plain' | 'agree' | 'caution' }) {
  const cls = tone === 'agree' ? 'border-agree text-agree' : tone === 'caution' ? 'border-caution text-caution' : 'border-rule text-muted';
  return <span className={`inline-block rounded-full border px-2 py-0.5 text-xs font-semibold ${cls}`}>{children}</span>;
}
