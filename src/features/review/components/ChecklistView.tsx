import type { CheckItem, CheckState } from '../../../../shared/review/checklist';

// Symbol and word as well as colour, so the state reads in print and without colour vision.
const MARKS: Record<CheckState, { symbol: string; word: string; mark: string }> = {
  pass: { symbol: '✓', word: 'Pass', mark: 'border-agree bg-agree-soft text-agree' },
  attention: { symbol: '!', word: 'Needs attention', mark: 'border-caution bg-caution-soft text-caution' },
  not_needed: { symbol: '–', word: 'Not needed', mark: 'border-rule bg-paper text-muted' },
};

/** The system-filled review checklist: one line per check, its state, and why. */
export function ChecklistView({ items }: { items: CheckItem[] }) {
  return (
    <ul className="flex flex-col gap-3">
      {items.map((item) => {
        const m = MARKS[item.state];
        return (
          <li key={item.id} className="flex gap-3" data-check={item.id} data-state={item.state}>
            <span aria-hidden className={`mt-0.5 flex h-6 w-6 shrink-0 items-center justify-center rounded-full border-2 text-sm font-bold ${m.mark}`}>
              {m.symbol}
            </span>
            <div className="min-w-0">
              <p className="text-sm">
                <span className="font-semibold">{item.label}</span>
                <span className={`ml-2 text-xs font-semibold uppercase tracking-wide ${item.state === 'pass' ? 'text-agree' : item.state === 'attention' ? 'text-caution' : 'text-muted'}`}>
                  {m.word}
                </span>
              </p>
              <p className={`text-sm break-words ${item.state === 'not_needed' ? 'text-muted' : ''}`}>{item.detail}</p>
            </div>
          </li>
        );
      })}
    </ul>
  );
}
