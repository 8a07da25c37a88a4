import { useState } from 'react';
import type { Comment } from '../../../../shared/schemas/case';
import { Button } from '../../../components/ui/Button';
import { ConfirmDialog } from '../../../components/ui/Dialog';
import { Markdown } from '../../../components/ui/Markdown';
import { Badge } from '../../../components/ui/Panel';
import { TextAreaField } from '../../../components/ui/TextAreaField';
import { useDeleteComment } from '../api/delete-comment';
import { useEditComment } from '../api/edit-comment';
import { useHideComment } from '../api/hide-comment';

const when = (iso: string) => new Date(iso).toLocaleString([], { dateStyle: 'medium', timeStyle: 'short' });

export function CommentItem({ comment, caseId }: { comment: Comment; caseId: number }) {
  const edit = useEditComment(caseId);
  const remove = useDeleteComment(caseId);
  const hide = useHideComment(caseId);
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState(comment.body);
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState('');
  const onError = (e: Error) => setError(e.message);
  const save = () => {
    if (!draft.trim()) return setError('Write something first');
    edit.mutate({ commentId: comment.id, body: draft }, { onSuccess: () => setEditing(false), onError });
  };
  const { permissions: can } = comment;
  return (
    <li className="rounded-md border border-rule bg-sheet p-3" aria-label={`Comment by ${comment.authorName}`}>
      <div className="flex flex-wrap items-baseline gap-x-2 text-sm">
        <span className="font-semibold">{comment.authorName}</span>
        <span className="text-xs text-muted">
          {when(comment.createdAt)}
          {comment.updatedAt !== comment.createdAt && !comment.hidden ? ' · edited' : ''}
        </span>
        {comment.hidden && <Badge tone="caution">hidden by a moderator</Badge>}
      </div>
      {editing ? (
        <div className="mt-2 flex flex-col gap-2">
          <TextAreaField label="Edit your comment" rows={4} value={draft} onChange={(e) => setDraft(e.target.value)} />
          <div className="flex gap-2">
            <Button type="button" onClick={save} busy={edit.isPending}>
              Save comment
            </Button>
            <Button type="button" variant="secondary" onClick={() => setEditing(false)}>
              Cancel
            </Button>
          </div>
        </div>
      ) : comment.hidden && !comment.body ? (
        <p className="mt-1 text-sm text-muted italic">This comment was hidden by a moderator.</p>
      ) : (
        <Markdown className={`mt-1 text-sm ${comment.hidden ? 'opacity-70' : ''}`} references={comment.references}>{comment.body}</Markdown>
      )}
      {error && (
        <p role="alert" className="mt-1 text-xs font-semibold text-caution">
          {error}
        </p>
      )}
      {!editing && (can.edit || can.delete || can.hide) && (
        <div className="mt-2 flex flex-wrap gap-1 text-xs">
          {can.edit && (
            <Button type="button" variant="quiet" className="px-2! py-1! text-xs!" onClick={() => (setDraft(comment.body), setEditing(true))}>
              Edit
            </Button>
          )}
          {can.delete && (
            <Button type="button" variant="quiet" className="px-2! py-1! text-xs!" onClick={() => setConfirming(true)}>
              Delete
            </Button>
          )}
          {can.hide && (
            <Button
              type="button"
              variant="quiet"
              className="px-2! py-1! text-xs!"
              busy={hide.isPending}
              onClick={() => hide.mutate({ commentId: comment.id, hidden: !comment.hidden }, { onError })}
            >
              {comment.hidden ? 'Show again' : 'Hide'}
            </Button>
          )}
        </div>
      )}
      <ConfirmDialog
        open={confirming}
        title="Delete your comment?"
        confirmLabel="Delete comment"
        tone="danger"
        busy={remove.isPending}
        onConfirm={() => remove.mutate(comment.id, { onError, onSettled: () => setConfirming(false) })}
        onCancel={() => setConfirming(false)}
      >
        <p>It is removed from the case for everyone.</p>
      </ConfirmDialog>
    </li>
  );
}
