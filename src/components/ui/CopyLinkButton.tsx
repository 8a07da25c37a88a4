import { useEffect, useState } from 'react';
import { Button } from './Button';

type Outcome = 'idle' | 'copied' | 'failed';

/** Puts the address of the current view on the clipboard and says so beside the button. */
export function CopyLinkButton({ label = 'Copy link', className = '' }: { label?: string; className?: string }) {
  const [outcome, setOutcome] = useState<Outcome>('idle');
  useEffect(() => {
    if (outcome === 'idle') return;
    const t = setTimeout(() => setOutcome('idle'), 2500);
    return () => clearTimeout(t);
  }, [outcome]);
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(window.location.href);
      setOutcome('copied');
    } catch {
      // a page served over plain http (not localhost) has no clipboard API
      setOutcome('failed');
    }
  };
  return (
    <span className={`inline-flex items-center gap-2 ${className}`}>
      <Button type="button" variant="secondary" className="px-3! py-1.5! text-xs!" onClick={copy}>
        {label}
      </Button>
      <span role="status" className={`text-xs ${outcome === 'failed' ? 'text-caution' : 'text-agree'}`} data-testid="copy-link-status">
        {outcome === 'copied' ? 'Link copied' : outcome === 'failed' ? 'Copy the address bar instead' : ''}
      </span>
    </span>
  );
}
