import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button } from './Button';

export interface DialogProps {
  open: boolean;
  onClose: () => void;
  title: string;
  /** Visually hide the title (it still labels the dialog for screen readers). */
  hideTitle?: boolean;
  children: ReactNode;
  className?: string;
  onKeyDown?: (e: React.KeyboardEvent<HTMLDialogElement>) => void;
}

/**
 * A modal on the native <dialog>: showModal() makes the rest of the page inert, so focus stays
 * inside; Esc closes it, and focus goes back to where it was.
 */
export function Dialog({ open, onClose, title, hideTitle, children, className = '', onKeyDown }: DialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      const before = document.activeElement as HTMLElement | null;
      dialog.showModal();
      return () => {
        if (dialog.open) dialog.close();
        before?.focus?.();
      };
    }
  }, [open]);
  if (!open) return null;
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      onKeyDown={onKeyDown}
      className={`m-auto max-h-[92vh] w-[min(36rem,calc(100vw-2rem))] rounded-lg border border-rule bg-sheet p-0 text-ink shadow-xl backdrop:bg-black/50 ${className}`}
    >
      <div className="p-5">
        <h2 id={titleId} className={hideTitle ? 'sr-only' : 'mb-3 text-lg'}>
          {title}
        </h2>
        {children}
      </div>
    </dialog>
  );
}

export interface ConfirmDialogProps {
  open: boolean;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  tone?: 'primary' | 'danger';
  busy?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}

/** Asks once before an action that cannot simply be undone. */
export function ConfirmDialog({ open, title, children, confirmLabel, tone = 'primary', busy, onConfirm, onCancel }: ConfirmDialogProps) {
  return (
    <Dialog open={open} onClose={onCancel} title={title}>
      <div className="text-sm">{children}</div>
      <div className="mt-5 flex flex-wrap justify-end gap-2">
        <Button variant="secondary" onClick={onCancel} autoFocus>
          Cancel
        </Button>
        <Button variant={tone} onClick={onConfirm} busy={busy}>
          {confirmLabel}
        </Button>
      </div>
    </Dialog>
  );
}
