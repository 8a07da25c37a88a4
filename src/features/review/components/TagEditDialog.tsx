import { useState } from 'react';
import type { TagInfo } from '../../../../shared/schemas/tags';
import { tagMergeSchema, tagRenameSchema, tagSynonymsSchema } from '../../../../shared/schemas/tags';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { ChipsInput } from '../../../components/ui/ChipsInput';
import { Dialog } from '../../../components/ui/Dialog';
import { SelectField, TextField } from '../../../components/ui/Field';
import { ApiError } from '../../../lib/api-client';
import { applyServerError, useZodForm } from '../../../lib/forms';
import { useMergeTag } from '../api/merge-tag';
import { useRenameTag } from '../api/rename-tag';
import { useSetTagSynonyms } from '../api/set-tag-synonyms';

export type TagEditMode = 'rename' | 'merge' | 'synonyms';

interface FormProps {
  tag: TagInfo;
  others: TagInfo[];
  onClose: () => void;
  onDone: (message: string) => void;
}

function Actions({ submit, busy, onClose }: { submit: string; busy: boolean; onClose: () => void }) {
  return (
    <div className="mt-5 flex flex-wrap justify-end gap-2">
      <Button type="button" variant="secondary" onClick={onClose}>
        Cancel
      </Button>
      <Button type="submit" busy={busy}>
        {submit}
      </Button>
    </div>
  );
}

function RenameForm({ tag, onClose, onDone }: FormProps) {
  const rename = useRenameTag();
  const form = useZodForm(tagRenameSchema, { to: tag.tag });
  const [message, setMessage] = useState('');
  const onSubmit = form.handleSubmit(async ({ to }) => {
    try {
      await rename.mutateAsync({ tag: tag.tag, to });
      onDone(`Renamed ${tag.tag} to ${to}; ${tag.tag} is now a synonym of it.`);
    } catch (err) {
      setMessage(applyServerError(form, err));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      {message && <Alert tone="caution">{message}</Alert>}
      <TextField
        label="New name"
        autoFocus
        className="font-mono"
        hint={`Its ${tag.count} case${tag.count === 1 ? '' : 's'} move to the new name. The old name becomes a synonym, so searches and new cases that use it land here.`}
        error={form.formState.errors.to?.message}
        {...form.register('to')}
      />
      <Actions submit="Rename" busy={rename.isPending} onClose={onClose} />
    </form>
  );
}

function MergeForm({ tag, others, onClose, onDone }: FormProps) {
  const merge = useMergeTag();
  const form = useZodForm(tagMergeSchema, { into: '' });
  const [message, setMessage] = useState('');
  const onSubmit = form.handleSubmit(async ({ into }) => {
    try {
      await merge.mutateAsync({ tag: tag.tag, into });
      onDone(`Merged ${tag.tag} into ${into}.`);
    } catch (err) {
      setMessage(applyServerError(form, err));
    }
  });
  const options = [{ value: '', label: 'Choose a tag…' }, ...others.filter((t) => !t.retired).map((t) => ({ value: t.tag, label: `${t.tag} (${t.count})` }))];
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      {message && <Alert tone="caution">{message}</Alert>}
      <SelectField
        label="Merge into"
        autoFocus
        options={options}
        hint={`Every case tagged ${tag.tag} gets the chosen tag instead, and ${tag.tag} becomes its synonym.`}
        error={form.formState.errors.into?.message}
        {...form.register('into')}
      />
      <Actions submit="Merge" busy={merge.isPending} onClose={onClose} />
    </form>
  );
}

function SynonymsForm({ tag, onClose, onDone }: FormProps) {
  const save = useSetTagSynonyms();
  const [synonyms, setSynonyms] = useState(tag.synonyms);
  const [message, setMessage] = useState('');
  const one = tagSynonymsSchema.shape.synonyms.element;
  const onSubmit = async (e: React.FormEvent) => {
    e.preventDefault();
    setMessage('');
    try {
      await save.mutateAsync({ tag: tag.tag, synonyms });
      onDone(synonyms.length ? `Synonyms of ${tag.tag}: ${synonyms.join(', ')}.` : `${tag.tag} has no synonyms now.`);
    } catch (err) {
      setMessage(err instanceof ApiError ? err.message : 'Something went wrong. Try again.');
    }
  };
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      {message && <Alert tone="caution">{message}</Alert>}
      <ChipsInput
        label="Synonyms"
        value={synonyms}
        onChange={setSynonyms}
        max={30}
        placeholder="e.g. x10, ten-times"
        hint="Search treats each synonym as this tag, and a case tagged with a synonym gets this tag. Enter or comma adds one."
        accept={(text) => {
          const r = one.safeParse(text);
          if (!r.success) return { ok: false, message: r.error.issues[0]?.message ?? 'Not a synonym' };
          if (r.data === tag.tag) return { ok: false, message: 'A tag cannot be its own synonym' };
          return { ok: true, value: r.data };
        }}
      />
      <Actions submit="Save synonyms" busy={save.isPending} onClose={onClose} />
    </form>
  );
}

const TITLES: Record<TagEditMode, (tag: string) => string> = {
  rename: (t) => `Rename ${t}`,
  merge: (t) => `Merge ${t} into another tag`,
  synonyms: (t) => `Synonyms of ${t}`,
};

/** The dialog for one curation step on one tag. */
export function TagEditDialog({ mode, ...props }: FormProps & { mode: TagEditMode }) {
  const Form = mode === 'rename' ? RenameForm : mode === 'merge' ? MergeForm : SynonymsForm;
  return (
    <Dialog open onClose={props.onClose} title={TITLES[mode](props.tag.tag)}>
      <Form {...props} />
    </Dialog>
  );
}
