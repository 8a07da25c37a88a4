import type { Formula } from '../topics/types';

/** Formulas as readable mono text, each with what it says. */
export function FormulaList({ formulas }: { formulas: Formula[] }) {
  return (
    <dl className="divide-y divide-rule rounded-md border border-rule bg-paper" aria-label="Formulas">
      {formulas.map((f) => (
        <div key={f.text} className="flex flex-col gap-1 px-4 py-3 sm:flex-row sm:items-baseline sm:gap-6">
          <dt className="font-mono text-[0.95rem] sm:min-w-[24rem]">
            <code data-testid="formula">{f.text}</code>
          </dt>
          <dd className="text-sm text-muted">{f.meaning}</dd>
        </div>
      ))}
    </dl>
  );
}
