import { useEffect, useId, useRef, useState } from 'react';
import { registerList } from './list-registry';

/**
 * Makes a list of cases walkable with j/k and openable with Enter. Spread `listProps` on the
 * element holding the rows and `rowProps(i)` on each row; the selected row carries
 * aria-current and its first link takes the focus, so the focus ring shows where j/k went.
 */
export function useKeyboardList<T>(items: readonly T[], onOpen: (item: T) => void) {
  const id = useId();
  const [selected, setSelected] = useState(-1);
  const latest = useRef({ items, onOpen, selected });
  latest.current = { items, onOpen, selected };
  const moved = useRef(false);

  // new rows (a new page, a new search): nothing is selected until j or k is pressed
  useEffect(() => setSelected(-1), [items]);

  useEffect(
    () =>
      registerList({
        container: () => document.querySelector(`[data-kb-list="${CSS.escape(id)}"]`),
        move: (delta) => {
          const { items: rows, selected: at } = latest.current;
          if (rows.length === 0) return;
          moved.current = true;
          setSelected(at < 0 ? (delta > 0 ? 0 : rows.length - 1) : Math.min(rows.length - 1, Math.max(0, at + delta)));
        },
        open: () => {
          const { items: rows, selected: at, onOpen: open } = latest.current;
          if (at < 0 || at >= rows.length) return false;
          open(rows[at]);
          return true;
        },
      }),
    [id],
  );

  useEffect(() => {
    if (!moved.current || selected < 0) return;
    moved.current = false;
    // the table and the phone cards both render the rows; only one of them is on screen
    const rows = document.querySelectorAll<HTMLElement>(`[data-kb-list="${CSS.escape(id)}"] [data-kb-row="${selected}"]`);
    const row = Array.from(rows).find((r) => r.getClientRects().length > 0);
    if (!row) return;
    row.scrollIntoView?.({ block: 'nearest' });
    (row.querySelector<HTMLElement>('a[href]') ?? row).focus({ preventScroll: true });
  }, [selected, id]);

  return {
    selected,
    listProps: { 'data-kb-list': id },
    rowProps: (i: number) => ({ 'data-kb-row': i, 'aria-current': i === selected ? ('true' as const) : undefined }),
  };
}
