import { Tex } from '../../../components/ui/Tex';
import type { Formula } from '../topics/types';

/** Formulas typeset from TeX, each with what it says. */
export function FormulaList({ formulas }: { formulas: Formula[] }) {
  return (
    <dl className="divide-y divide-rule rounded-md border border-rule bg-paper" aria-label="Formulas">
      {formulas.map((f) => (
        <div key={f.tex} className="flex flex-col gap-1 px-4 py-3 sm:flex-row sm:items-baseline sm:gap-6">
          <dt className="text-[1.05rem] sm:min-w-[24rem]" data-testid="formula">
            <Tex tex={f.tex} />
          </dt>
          <dd className="text-sm text-muted">{f.meaning}</dd>
        </div>
      ))}
    </dl>
  );
}
