import { ApiError } from '../../../lib/api-client';
import type { DiagnoseFormState } from '../hooks/use-diagnose-form';

/** Whether the server, running the same engine on the same input, ranked the causes the same way. */
export function ServerCheck({ server }: { server: DiagnoseFormState['server'] }) {
  let tone = 'border-rule text-muted';
  let text = 'Computed in your browser. Press Diagnose to have the server recompute it.';
  if (server.pending) text = 'Asking the server…';
  else if (server.error) {
    tone = 'border-caution bg-caution-soft text-ink';
    text =
      server.error instanceof ApiError && server.error.status === 400
        ? `The server refused this setup: ${server.error.message}`
        : `The server could not recompute this: ${server.error.message}`;
  } else if (server.agreement?.agrees) {
    tone = 'border-agree bg-agree-soft text-ink';
    text = 'The server recomputed this diagnosis and agrees: same causes, same order, same numbers.';
  } else if (server.agreement) {
    tone = 'border-caution bg-caution-soft text-ink';
    text = `The server's ranking differs from the browser's (by up to ${(server.agreement.largestDifference * 100).toFixed(1)} points of likelihood). Reload the page to get the current engine.`;
  } else if (!server.current && !server.pending) {
    text = 'Computed in your browser as you type. Press Diagnose to have the server recompute it.';
  }
  return (
    <p role="status" data-testid="server-check" className={`rounded-md border-l-4 px-3 py-2 text-xs ${tone}`}>
      {text}
    </p>
  );
}
