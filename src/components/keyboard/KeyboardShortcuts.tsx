import { Fragment, useEffect, useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Dialog } from '../ui/Dialog';
import { activeList } from './list-registry';
import { GO_TO, SHORTCUT_GROUPS, hasCommandModifier, isTypingTarget } from './shortcuts';

// how long `g` waits for the letter that says where to go
const GO_TO_WAIT_MS = 1500;

/** The search box a page marks with data-kb-search, if one is on screen. */
function pageSearchBox(): HTMLElement | null {
  const boxes = document.querySelectorAll<HTMLElement>('[data-kb-search]');
  return Array.from(boxes).find((b) => b.getClientRects().length > 0) ?? null;
}

/** The sheet `?` opens: every shortcut, grouped. */
export function ShortcutSheet({ open, onClose }: { open: boolean; onClose: () => void }) {
  return (
    <Dialog open={open} onClose={onClose} title="Keyboard shortcuts">
      <div className="flex flex-col gap-4 text-sm" data-testid="shortcut-sheet">
        {SHORTCUT_GROUPS.map((group) => (
          <section key={group.title}>
            <h3 className="mb-1.5 font-sans text-xs font-semibold tracking-wide text-muted uppercase">{group.title}</h3>
            <dl className="grid grid-cols-[6rem_1fr] gap-x-3 gap-y-1.5">
              {group.shortcuts.map((s) => (
                <Fragment key={s.keys.join(' ')}>
                  <dt className="flex items-center gap-1">
                    {s.keys.map((k, i) => (
                      <Fragment key={k}>
                        {i > 0 && <span className="text-xs text-muted">{s.sequence ? 'then' : '+'}</span>}
                        <kbd className="rounded border border-rule bg-paper px-1.5 py-0.5 font-mono text-xs shadow-[0_1px_0_var(--ft-rule)]">{k}</kbd>
                      </Fragment>
                    ))}
                  </dt>
                  <dd>{s.action}</dd>
                </Fragment>
              ))}
            </dl>
          </section>
        ))}
        <p className="text-xs text-muted">The letters do nothing while you type in a field, or with Ctrl, Alt or ⌘ held.</p>
        <div className="flex justify-end">
          <button type="button" onClick={onClose} className="rounded-md border border-rule px-3 py-1.5 text-sm font-semibold hover:border-ink" autoFocus>
            Close
          </button>
        </div>
      </div>
    </Dialog>
  );
}

/**
 * The app-wide keys (mounted once in the shell for a signed-in reader): `/` search, `n` new
 * case, `?` the sheet, `g` then a letter to go somewhere, j/k/Enter in the list on screen.
 */
export function KeyboardShortcuts() {
  const navigate = useNavigate();
  const [sheetOpen, setSheetOpen] = useState(false);
  const goPending = useRef(0);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.defaultPrevented || hasCommandModifier(e) || isTypingTarget(e.target)) return;
      // a modal dialog (this sheet, a confirmation) owns the keyboard until it closes
      if (document.querySelector('dialog[open]')) return;
      const key = e.key;
      if (goPending.current && Date.now() - goPending.current < GO_TO_WAIT_MS) {
        goPending.current = 0;
        const to = GO_TO[key.toLowerCase()];
        if (to) {
          e.preventDefault();
          navigate(to.path);
          return;
        }
      }
      goPending.current = 0;
      if (key === '?') {
        e.preventDefault();
        setSheetOpen(true);
        return;
      }
      if (e.shiftKey) return;
      switch (key) {
        case '/': {
          e.preventDefault();
          const box = pageSearchBox();
          if (box) box.focus();
          else navigate('/', { state: { focusSearch: true } });
          return;
        }
        case 'n':
          e.preventDefault();
          navigate('/cases/new');
          return;
        case 'g':
          goPending.current = Date.now();
          return;
        case 'j':
        case 'k': {
          const list = activeList();
          if (!list) return;
          e.preventDefault();
          list.move(key === 'j' ? 1 : -1);
          return;
        }
        case 'Enter': {
          // on a link or button, Enter already does what that control says
          if ((e.target as Element | null)?.closest?.('a[href], button, summary, [role="button"]')) return;
          if (activeList()?.open()) e.preventDefault();
          return;
        }
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [navigate]);

  return <ShortcutSheet open={sheetOpen} onClose={() => setSheetOpen(false)} />;
}
