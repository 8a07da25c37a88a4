import { useState } from 'react';
import { hasRole, type Role } from '../../../../shared/auth/roles';
import { NOTIFICATION_KINDS, NOTIFICATION_LABELS, type NotificationKind } from '../../../../shared/schemas/review';
import { Alert } from '../../../components/ui/Alert';
import { Loading, Panel } from '../../../components/ui/Panel';
import { useNotificationPrefs, type NotificationMode } from '../api/get-notification-prefs';
import { useUpdateNotificationPrefs } from '../api/update-notification-prefs';
import { WatchList } from './WatchList';

const MODES: { mode: NotificationMode; label: string }[] = [
  { mode: 'instant', label: 'Instant' },
  { mode: 'digest', label: 'Daily digest' },
  { mode: 'off', label: 'Off' },
];

function KindChoice({ kind, value, onChange }: { kind: NotificationKind; value: NotificationMode; onChange: (m: NotificationMode) => void }) {
  return (
    <fieldset className="flex flex-col gap-2 py-3 sm:flex-row sm:items-center sm:justify-between sm:gap-4">
      <legend className="float-left text-sm sm:max-w-[55%]">{NOTIFICATION_LABELS[kind]}</legend>
      <div className="clear-left flex overflow-hidden rounded-md border border-rule sm:clear-none">
        {MODES.map(({ mode, label }) => (
          <label
            key={mode}
            className={`flex-1 cursor-pointer border-l border-rule px-3 py-1.5 text-center text-sm whitespace-nowrap first:border-l-0 has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:-outline-offset-3 has-[:focus-visible]:outline-agree ${
              value === mode ? 'bg-ink font-semibold text-paper' : 'bg-sheet hover:bg-paper'
            }`}
          >
            <input type="radio" name={`notify-${kind}`} value={mode} checked={value === mode} onChange={() => onChange(mode)} className="sr-only" />
            {label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/**
 * The profile's mail settings: each kind instant, in the daily digest, or off; then what the
 * person watches. The "submitted" kind only reaches moderators, so others do not see it.
 */
export function NotificationPrefs({ role }: { role: Role }) {
  const prefs = useNotificationPrefs();
  const update = useUpdateNotificationPrefs();
  const [saved, setSaved] = useState<{ kind: NotificationKind; mode: NotificationMode } | null>(null);
  const kinds = NOTIFICATION_KINDS.filter((k) => k !== 'submitted' || hasRole({ role }, 'moderator'));
  const change = (kind: NotificationKind, mode: NotificationMode) => {
    setSaved(null);
    update.mutate({ [kind]: mode }, { onSuccess: () => setSaved({ kind, mode }) });
  };
  return (
    <div className="mt-6 grid gap-6 md:grid-cols-2">
      <Panel title="E-mail notifications">
        <p className="text-sm text-muted">Choose per kind: a mail right away, one line in the daily digest, or nothing. Changes save at once.</p>
        {prefs.isPending && <Loading what="Loading your settings" />}
        {prefs.isError && <Alert tone="caution">{prefs.error.message}</Alert>}
        {update.isError && <Alert tone="caution">Not saved: {update.error.message}</Alert>}
        {prefs.data && (
          <div className="mt-2 divide-y divide-rule">
            {kinds.map((k) => (
              <KindChoice key={k} kind={k} value={prefs.data.prefs[k]} onChange={(m) => change(k, m)} />
            ))}
          </div>
        )}
        <p className="mt-2 h-5 text-xs text-agree" role="status">
          {saved && !update.isPending ? `Saved: ${NOTIFICATION_LABELS[saved.kind]} — ${MODES.find((m) => m.mode === saved.mode)!.label.toLowerCase()}.` : ''}
        </p>
      </Panel>
      <Panel title="Watching">
        <WatchList />
      </Panel>
    </div>
  );
}
