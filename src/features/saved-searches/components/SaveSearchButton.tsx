import { causeLabel } from '../../../components/ui/CauseChip';
import { useId, useState } from 'react';
import { SAVED_SEARCH_DELIVERIES, type SavedSearchDelivery } from '../../../../shared/schemas/saved-searches';
import { Button } from '../../../components/ui/Button';
import { useCreateSavedSearch } from '../api/create-saved-search';

export interface CurrentSearch {
  q: string;
  cause?: string;
  tag?: string;
}

const DELIVERY_LABELS: Record<SavedSearchDelivery, string> = { mail: 'Mail me at once', digest: 'In my daily digest' };

/**
 * "Save this search" beside the Bench search: keeps the words and facets under a name, and says
 * how to be told when a newly verified case matches.
 */
export function SaveSearchButton({ search }: { search: CurrentSearch }) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const [name, setName] = useState('');
  const [delivery, setDelivery] = useState<SavedSearchDelivery>('mail');
  const create = useCreateSavedSearch();
  const empty = search.q.trim() === '' && !search.cause && !search.tag;
  if (empty) return null;

  if (!open) {
    return (
      <div className="flex flex-wrap items-center gap-3">
        <Button
          type="button"
          variant="secondary"
          onClick={() => {
            setName(search.q.trim().slice(0, 80) || [search.cause, search.tag].filter(Boolean).join(' · '));
            create.reset();
            setOpen(true);
          }}
        >
          Save this search
        </Button>
        {create.isSuccess && (
          <p className="text-sm text-agree" role="status">
            Saved as “{create.data.savedSearch.name}”. You will be told when a matching case is verified; manage it on your profile.
          </p>
        )}
      </div>
    );
  }

  return (
    <form
      aria-label="Save this search"
      className="flex flex-col gap-3 rounded-md border border-rule bg-paper p-3"
      onSubmit={(e) => {
        e.preventDefault();
        create.mutate({ name, q: search.q.trim(), cause: search.cause, tag: search.tag, delivery }, { onSuccess: () => setOpen(false) });
      }}
    >
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-name`} className="text-sm font-semibold">
          Name of the saved search
        </label>
        <input
          id={`${id}-name`}
          value={name}
          maxLength={80}
          onChange={(e) => setName(e.target.value)}
          className="rounded-md border border-rule bg-sheet px-3 py-2"
          required
        />
        <p className="text-xs text-muted">
          Words: <span className="font-mono">{search.q.trim() || '(none)'}</span>
          {search.cause && <> · cause: {causeLabel(search.cause)}</>}
          {search.tag && <> · tag {search.tag}</>}
        </p>
      </div>
      <fieldset className="flex flex-wrap gap-4">
        <legend className="mb-1 text-sm font-semibold">When a newly verified case matches</legend>
        {SAVED_SEARCH_DELIVERIES.map((d) => (
          <label key={d} className="flex items-center gap-2 text-sm">
            <input type="radio" name={`${id}-delivery`} value={d} checked={delivery === d} onChange={() => setDelivery(d)} />
            {DELIVERY_LABELS[d]}
          </label>
        ))}
      </fieldset>
      {create.isError && (
        <p className="text-sm text-caution" role="alert">
          {create.error.message}
        </p>
      )}
      <div className="flex gap-2">
        <Button type="submit" busy={create.isPending}>
          Save
        </Button>
        <Button type="button" variant="quiet" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
