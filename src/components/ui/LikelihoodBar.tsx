/** A likelihood (0–1) as a bar and a percentage; the strongest reads in teal. */
export function LikelihoodBar({ value, strong }: { value: number; strong?: boolean }) {
  const pct = Math.max(0, Math.min(1, value)) * 100;
  const text = pct >= 10 ? pct.toFixed(0) : pct.toFixed(1);
  return (
    <div className="flex items-center gap-2">
      <div className="h-2 flex-1 overflow-hidden rounded-full bg-rule/60" aria-hidden>
        <div className={`h-full rounded-full ${strong ? 'bg-agree' : 'bg-muted'}`} style={{ width: `${pct}%` }} />
      </div>
      <span className="w-14 text-right font-mono text-xs">{text} %</span>
    </div>
  );
}
