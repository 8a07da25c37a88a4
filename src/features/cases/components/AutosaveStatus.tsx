import type { SaveState } from '../hooks/use-case-autosave';

const time = (d: Date) => d.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });

/** Where the draft stands: typed, saving, saved at a time, or not saved and why. */
export function AutosaveStatus({ state, quiet, isNew }: { state: SaveState; quiet?: boolean; isNew?: boolean }) {
  const { text, tone } = describe(state, isNew);
  return (
    <p role={quiet ? undefined : 'status'} aria-live={quiet ? undefined : 'polite'} data-testid={quiet ? undefined : 'autosave-status'} className={`text-sm ${tone} ${quiet ? 'max-w-[70vw] truncate' : ''}`}>
      {state.kind === 'saving' && <span className="mr-1.5 inline-block h-3 w-3 animate-spin rounded-full border-2 border-current border-t-transparent align-[-2px]" aria-hidden />}
      {text}
    </p>
  );
}

function describe(state: SaveState, isNew?: boolean): { text: string; tone: string } {
  switch (state.kind) {
    case 'clean':
      return { text: isNew ? 'Saves itself once it has a title and a summary' : 'All changes saved', tone: 'text-muted' };
    case 'dirty':
      return { text: 'Changes not saved yet…', tone: 'text-muted' };
    case 'saving':
      return { text: 'Saving…', tone: 'text-muted' };
    case 'saved':
      return { text: `Saved ${time(state.at)}`, tone: 'text-agree' };
    case 'failed':
      return { text: `Not saved: ${state.reason}`, tone: 'font-semibold text-caution' };
  }
}
