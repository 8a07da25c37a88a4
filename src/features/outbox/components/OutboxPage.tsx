import { Fragment, useRef } from 'react';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { Loading, PageHeader, Panel } from '../../../components/ui/Panel';
import type { OutboxMessage } from '../../../../shared/schemas/auth';
import { useMe } from '../../auth/api/get-me';
import { useOutbox } from '../api/get-outbox';

/** Plain text with its URLs made clickable; the HTML part is never rendered here. */
function LinkedText({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s]+)/g);
  return (
    <pre className="whitespace-pre-wrap break-words font-sans text-sm">
      {parts.map((p, i) =>
        /^https?:\/\//.test(p) ? (
          <a key={i} href={p} className="break-all text-agree underline underline-offset-2">
            {p}
          </a>
        ) : (
          <Fragment key={i}>{p}</Fragment>
        ),
      )}
    </pre>
  );
}

/**
 * Keys that stay with a mail as newer ones arrive on top (the list is newest first): its time,
 * address and subject, and how many identical ones came before it.
 */
function mailKeys(messages: OutboxMessage[]): string[] {
  const seen = new Map<string, number>();
  const keys: string[] = [];
  for (let i = messages.length - 1; i >= 0; i--) {
    const m = messages[i];
    const base = `${m.createdAt}|${m.to}|${m.subject}`;
    const n = seen.get(base) ?? 0;
    seen.set(base, n + 1);
    keys[i] = `${base}|${n}`;
  }
  return keys;
}

export function OutboxPage() {
  const { localMail, isFetching } = useMe();
  const outbox = useOutbox(localMail);
  // open: the newest mail on arrival and every mail that comes in while the page is open. Each
  // mail's `open` never changes after its first render, so what the reader opened or closed stays so.
  const firstLoad = useRef<{ newest: string | undefined; keys: Set<string> } | null>(null);
  const messages = outbox.data?.messages ?? [];
  const keys = mailKeys(messages);
  if (outbox.data && firstLoad.current === null) firstLoad.current = { newest: keys[0], keys: new Set(keys) };
  const opensAt = (key: string) => firstLoad.current !== null && (key === firstLoad.current.newest || !firstLoad.current.keys.has(key));
  if (!localMail && !isFetching)
    return (
      <>
        <PageHeader title="Outbox" />
        <Panel>
          <p>
            This server sends its mail to the SMTP relay set in <code className="font-mono">SMTP_URL</code>, so there is no local outbox to show. Mails that
            cannot be delivered stay queued and are retried; the relay's own logs say what left.
          </p>
        </Panel>
      </>
    );
  return (
    <>
      <PageHeader
        title="Outbox"
        lead="Every mail the app sent while the built-in local mail fake is in use (SMTP_URL unset); new mail shows here within seconds. Nothing here left this machine."
        actions={
          <Button variant="secondary" onClick={() => outbox.refetch()} busy={outbox.isFetching}>
            Refresh
          </Button>
        }
      />
      {outbox.isPending && <Loading what="Loading mails" />}
      {outbox.isError && <Alert tone="caution">{outbox.error.message}</Alert>}
      {outbox.data?.messages.length === 0 && <Panel>No mail has been sent yet.</Panel>}
      <ol className="flex flex-col gap-4">
        {messages.map((m, i) => (
          <li key={keys[i]}>
            <Panel>
              <details open={opensAt(keys[i])}>
                <summary className="cursor-pointer">
                  <span className="font-serif text-lg">{m.subject}</span>
                  <span className="ml-2 text-sm text-muted">
                    to <span className="font-mono">{m.to}</span> · {new Date(m.createdAt).toLocaleString()}
                  </span>
                </summary>
                <div className="mt-3 border-t border-rule pt-3">
                  <LinkedText text={m.text} />
                </div>
              </details>
            </Panel>
          </li>
        ))}
      </ol>
    </>
  );
}
