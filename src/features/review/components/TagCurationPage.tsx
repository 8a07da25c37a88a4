import { useState } from 'react';
import type { TagInfo } from '../../../../shared/schemas/tags';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { ConfirmDialog } from '../../../components/ui/Dialog';
import { Badge, Loading, PageHeader, Panel } from '../../../components/ui/Panel';
import { useTags } from '../api/list-tags';
import { useRetireTag } from '../api/retire-tag';
import { ReviewNav } from './ReviewNav';
import { TagEditDialog, type TagEditMode } from './TagEditDialog';

type Editing = { tag: TagInfo; mode: TagEditMode | 'retire' } | null;

// least used first brings up the one-off spellings that want merging
const SORTS = {
  name: { label: 'Name', compare: (a: TagInfo, b: TagInfo) => a.tag.localeCompare(b.tag) },
  least: { label: 'Least used first', compare: (a: TagInfo, b: TagInfo) => a.count - b.count || a.tag.localeCompare(b.tag) },
  most: { label: 'Most used first', compare: (a: TagInfo, b: TagInfo) => b.count - a.count || a.tag.localeCompare(b.tag) },
} as const;

function TagRow({ tag, onEdit, onRestore, restoring }: { tag: TagInfo; onEdit: (mode: TagEditMode | 'retire') => void; onRestore: () => void; restoring: boolean }) {
  return (
    <li className="flex flex-col gap-2 py-2.5 sm:flex-row sm:items-center sm:gap-4" data-tag={tag.tag}>
      <div className="min-w-0 flex-1">
        <p className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
          <span className={`font-mono font-semibold ${tag.retired ? 'text-muted line-through' : ''}`}>{tag.tag}</span>
          <span className="text-sm text-muted">
            <span className="font-mono text-ink">{tag.count}</span> {tag.count === 1 ? 'case' : 'cases'}
          </span>
          {tag.retired && <Badge tone="caution">retired</Badge>}
        </p>
        {tag.synonyms.length > 0 && (
          <p className="mt-1 text-sm text-muted">
            also matches <span className="font-mono text-ink">{tag.synonyms.join(', ')}</span>
          </p>
        )}
        {tag.description && <p className="mt-1 text-sm">{tag.description}</p>}
      </div>
      <div className="flex flex-wrap gap-2" role="group" aria-label={`Curate ${tag.tag}`}>
        <Button variant="secondary" className="px-3 py-1.5" onClick={() => onEdit('rename')}>
          Rename
        </Button>
        <Button variant="secondary" className="px-3 py-1.5" onClick={() => onEdit('merge')}>
          Merge into…
        </Button>
        <Button variant="secondary" className="px-3 py-1.5" onClick={() => onEdit('synonyms')}>
          Synonyms
        </Button>
        {tag.retired ? (
          <Button variant="secondary" className="min-w-[5.5rem] px-3 py-1.5" busy={restoring} onClick={onRestore}>
            Restore
          </Button>
        ) : (
          <Button variant="quiet" className="min-w-[5.5rem] px-3 py-1.5" onClick={() => onEdit('retire')}>
            Retire
          </Button>
        )}
      </div>
    </li>
  );
}

/** Tag curation for moderators: rename, merge, synonyms that feed search, retire and restore. */
export function TagCurationPage() {
  const tags = useTags();
  const retire = useRetireTag();
  const [filter, setFilter] = useState('');
  const [sort, setSort] = useState<keyof typeof SORTS>('name');
  const [editing, setEditing] = useState<Editing>(null);
  const [done, setDone] = useState('');
  const [error, setError] = useState('');

  const finish = (message: string) => {
    setEditing(null);
    setError('');
    setDone(message);
  };
  const setRetired = (tag: TagInfo, retired: boolean) =>
    retire.mutate(
      { tag: tag.tag, retired },
      {
        onSuccess: () => finish(retired ? `Retired ${tag.tag}: authors can no longer add it.` : `Restored ${tag.tag}.`),
        onError: (e) => {
          setEditing(null);
          setError(e.message);
        },
      },
    );

  const all = tags.data?.tags ?? [];
  const needle = filter.trim().toLowerCase();
  const shown = (needle ? all.filter((t) => t.tag.includes(needle) || t.synonyms.some((s) => s.includes(needle))) : all).toSorted(SORTS[sort].compare);
  return (
    <>
      <PageHeader title="Review desk" lead="Keep the tag vocabulary small and consistent, so a search for one name finds every case." />
      <ReviewNav />
      <Panel
        title="Tags"
        actions={
          <div className="flex flex-wrap items-center gap-2">
            <label htmlFor="tag-sort" className="text-sm font-semibold">
              Order
            </label>
            <select id="tag-sort" value={sort} onChange={(e) => setSort(e.target.value as keyof typeof SORTS)} className="rounded-md border border-rule bg-sheet px-2 py-1 text-sm">
              {Object.entries(SORTS).map(([k, s]) => (
                <option key={k} value={k}>
                  {s.label}
                </option>
              ))}
            </select>
            <label htmlFor="tag-filter" className="ml-2 text-sm font-semibold">
              Find a tag
            </label>
            <input
              id="tag-filter"
              type="search"
              value={filter}
              onChange={(e) => setFilter(e.target.value)}
              className="w-40 rounded-md border border-rule bg-sheet px-2 py-1 font-mono text-sm focus:border-ink focus:outline-none sm:w-56"
            />
          </div>
        }
      >
        <div className="flex flex-col gap-3">
          {done && <Alert tone="agree">{done}</Alert>}
          {error && <Alert tone="caution">{error}</Alert>}
        </div>
        {tags.isPending && <Loading what="Loading tags" />}
        {tags.isError && <Alert tone="caution">{tags.error.message}</Alert>}
        {tags.data && all.length === 0 && <p className="text-sm text-muted">No tags yet: they appear as authors tag their cases.</p>}
        {tags.data && all.length > 0 && shown.length === 0 && <p className="text-sm text-muted">No tag or synonym contains “{filter}”.</p>}
        <ul className="divide-y divide-rule" aria-label="Tags">
          {shown.map((t) => (
            <TagRow
              key={t.tag}
              tag={t}
              onEdit={(mode) => setEditing({ tag: t, mode })}
              onRestore={() => setRetired(t, false)}
              restoring={retire.isPending && retire.variables?.tag === t.tag}
            />
          ))}
        </ul>
      </Panel>
      {editing && editing.mode !== 'retire' && (
        <TagEditDialog mode={editing.mode} tag={editing.tag} others={all.filter((t) => t.tag !== editing.tag.tag)} onClose={() => setEditing(null)} onDone={finish} />
      )}
      <ConfirmDialog
        open={editing?.mode === 'retire'}
        title={`Retire ${editing?.tag.tag ?? ''}?`}
        confirmLabel="Retire tag"
        tone="danger"
        busy={retire.isPending}
        onConfirm={() => editing && setRetired(editing.tag, true)}
        onCancel={() => setEditing(null)}
      >
        Authors can no longer add it to a case. The {editing?.tag.count ?? 0} case{editing?.tag.count === 1 ? '' : 's'} that carry it keep it, and you can restore it later. To
        fold it into another tag instead, merge it.
      </ConfirmDialog>
    </>
  );
}
