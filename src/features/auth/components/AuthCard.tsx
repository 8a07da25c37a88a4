import type { ReactNode } from 'react';

/** The narrow sheet that holds the signed-out forms. */
export function AuthCard({ title, lead, children }: { title: string; lead?: ReactNode; children: ReactNode }) {
  return (
    <div className="mx-auto mt-6 w-full max-w-md sm:mt-14">
      <div className="rounded-lg border border-rule bg-sheet p-6 shadow-[0_2px_0_var(--ft-rule)] sm:p-8">
        <h1 className="text-2xl">{title}</h1>
        {lead && <p className="mt-2 text-sm text-muted">{lead}</p>}
        <div className="mt-6">{children}</div>
      </div>
    </div>
  );
}
