import { useState } from 'react';
import { commentInputSchema } from '../../../../shared/schemas/case';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { Markdown } from '../../../components/ui/Markdown';
import { Loading } from '../../../components/ui/Panel';
import { TextAreaField } from '../../../components/ui/TextAreaField';
import { applyServerError, useZodForm } from '../../../lib/forms';
import { useAddComment } from '../api/add-comment';
import { useComments } from '../api/list-comments';
import { useDraftReferences } from '../api/draft-references';
import { CommentItem } from './CommentItem';

export function CommentsSection({ caseId, canComment }: { caseId: number; canComment: boolean }) {
  const comments = useComments(caseId);
  const add = useAddComment(caseId);
  const form = useZodForm(commentInputSchema, { body: '' });
  const [message, setMessage] = useState('');
  const [preview, setPreview] = useState(false);
  const body = form.watch('body');
  // only while previewing: the numbers are looked up when the preview is shown
  const references = useDraftReferences(preview ? body : null);
  const onSubmit = form.handleSubmit(async ({ body }) => {
    setMessage('');
    try {
      await add.mutateAsync(body);
      form.reset({ body: '' });
      setPreview(false);
    } catch (err) {
      setMessage(applyServerError(form, err));
    }
  });
  return (
    <div className="flex flex-col gap-3">
      {comments.isPending && <Loading what="Loading comments" />}
      {comments.isError && <Alert tone="caution">{comments.error.message}</Alert>}
      {comments.data && comments.data.comments.length === 0 && <p className="text-sm text-muted">No comments yet.</p>}
      {comments.data && comments.data.comments.length > 0 && (
        <ol className="flex flex-col gap-2">
          {comments.data.comments.map((c) => (
            <CommentItem key={c.id} comment={c} caseId={caseId} />
          ))}
        </ol>
      )}
      {canComment && (
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-2">
          {message && <Alert tone="caution">{message}</Alert>}
          {preview ? (
            <div className="min-h-24 rounded-md border border-dashed border-rule bg-paper/60 px-3 py-1 text-sm" aria-label="Comment preview" role="region">
              {body ? <Markdown references={references}>{body}</Markdown> : <p className="py-2 text-muted">Nothing to preview.</p>}
            </div>
          ) : (
            <TextAreaField label="Add a comment" rows={3} hint="Markdown works here." error={form.formState.errors.body?.message} {...form.register('body')} />
          )}
          <div className="flex gap-2">
            <Button type="submit" busy={add.isPending}>
              Post comment
            </Button>
            <Button type="button" variant="secondary" aria-pressed={preview} onClick={() => setPreview((p) => !p)}>
              {preview ? 'Back to writing' : 'Preview'}
            </Button>
          </div>
        </form>
      )}
    </div>
  );
}
