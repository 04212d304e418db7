import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { EyeOff, Eye, Flag, MessageCircle, Trash2 } from 'lucide-react';
import { Link } from 'react-router-dom';
import { Button, ButtonLink } from '@/components/ui/button';
import { TextAreaField } from '@/components/ui/field';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Loading } from '@/components/ui/page';
import { ApiError } from '@/lib/api-client';
import { paths } from '@/config/paths';
import { COMMENT_MAX, characterCount, type CreateCommentInput } from '@/schemas/share';
import { useComments } from '../api/get-comments';
import { CreateCommentSchema, useCreateComment } from '../api/create-comment';
import { useDeleteComment } from '../api/delete-comment';
import { useSetCommentHidden } from '../api/hide-comment';
import type { ShowcaseComment } from '@/types/showcase';
import { formatWhen } from '../format';
import { ReportDialog } from './report-dialog';
import { Section } from './showcase-sections';

/** Comments are rendered as text nodes only (whitespace kept), so markup in one can never become HTML. */
export function CommentsSection({ token, signedIn, isOwner }: { token: string; signedIn: boolean; isOwner: boolean }) {
  const comments = useComments(token);
  const [reporting, setReporting] = useState<number | null>(null);
  const [deleting, setDeleting] = useState<ShowcaseComment | null>(null);
  const remove = useDeleteComment(token);
  const hide = useSetCommentHidden(token);
  const list = comments.data ?? [];
  const next = encodeURIComponent(paths.showcase(token));

  return (
    <Section title={`Comments${list.length ? ` (${list.filter((c) => !c.hidden).length})` : ''}`} id="comments" className="print:hidden">
      {comments.isPending ? (
        <Loading label="Loading comments…" />
      ) : list.length ? (
        <ul className="space-y-3">
          {list.map((c) => (
            <li key={c.id} className={`rounded-soft p-4 ${c.hidden ? 'border-2 border-dashed border-wool dark:border-[#4a423c]' : 'bg-oat dark:bg-ink/60'}`}>
              <div className="flex flex-wrap items-baseline justify-between gap-x-3">
                <p className="font-bold">
                  {c.author.displayName}
                  {c.mine ? <span className="font-normal text-ink/60 dark:text-oat/60"> (you)</span> : null}
                </p>
                <p className="text-sm text-ink/60 dark:text-oat/60">
                  <time dateTime={c.createdAt}>{formatWhen(c.createdAt)}</time>
                </p>
              </div>
              {c.hidden ? (
                <p className="mt-1 flex items-center gap-1.5 text-sm font-semibold text-clay">
                  <EyeOff aria-hidden className="h-4 w-4" />
                  {c.hiddenByAdmin ? 'Hidden by an admin after a report. Only you can see it.' : 'Hidden. Only you can see it.'}
                </p>
              ) : null}
              <p className="mt-1 whitespace-pre-wrap break-words" data-testid="comment-body">
                {c.body}
              </p>
              <div className="mt-2 flex flex-wrap gap-1">
                {c.canHide && !(c.hidden && c.hiddenByAdmin) ? (
                  <Button variant="quiet" pending={hide.isPending && hide.variables?.id === c.id} onClick={() => hide.mutate({ id: c.id, hidden: !c.hidden })}>
                    {c.hidden ? <Eye aria-hidden className="h-4 w-4" /> : <EyeOff aria-hidden className="h-4 w-4" />}
                    {c.hidden ? 'Show again' : 'Hide'}
                  </Button>
                ) : null}
                {c.canDelete ? (
                  <Button variant="quiet" onClick={() => setDeleting(c)}>
                    <Trash2 aria-hidden className="h-4 w-4" /> Delete
                  </Button>
                ) : null}
                {signedIn && !c.mine && !c.hidden ? (
                  <Button variant="quiet" onClick={() => setReporting(c.id)} aria-label={`Report the comment by ${c.author.displayName}`}>
                    <Flag aria-hidden className="h-4 w-4" /> Report
                  </Button>
                ) : null}
              </div>
            </li>
          ))}
        </ul>
      ) : (
        <p className="flex items-center gap-2 text-ink/70 dark:text-oat/70">
          <MessageCircle aria-hidden className="h-5 w-5" /> No comments yet.
          {signedIn && !isOwner ? ' Be the first to say something kind.' : ''}
        </p>
      )}

      <div className="mt-5">
        {signedIn ? (
          <CommentForm token={token} />
        ) : (
          <div className="rounded-soft bg-wool/70 p-4 dark:bg-[#3a3430]">
            <p className="font-semibold">Sign in to leave a comment or a cheer.</p>
            <p className="mt-1 text-sm text-ink/75 dark:text-oat/75">Friends with a Whorlbook account can say hello here. Anyone with the link can read along.</p>
            <div className="mt-3 flex flex-wrap gap-2">
              <ButtonLink to={`${paths.signIn}?next=${next}`}>Sign in to comment</ButtonLink>
              <Link to={`${paths.signUp}?next=${next}`} className="flex min-h-tap items-center px-3 font-semibold text-moss underline dark:text-[#9cc3a8]">
                New here? Make an account
              </Link>
            </div>
          </div>
        )}
      </div>

      {reporting !== null ? <ReportDialog target={{ shareToken: token, commentId: reporting }} onClose={() => setReporting(null)} /> : null}
      <ConfirmDialog
        open={deleting !== null}
        title="Delete this comment?"
        confirmLabel="Delete comment"
        pending={remove.isPending}
        onCancel={() => setDeleting(null)}
        onConfirm={() => deleting && remove.mutate(deleting.id, { onSuccess: () => setDeleting(null) })}
      >
        <p>It is removed for good{deleting && !deleting.mine ? `; ${deleting.author.displayName} will not be told` : ''}.</p>
      </ConfirmDialog>
    </Section>
  );
}

function CommentForm({ token }: { token: string }) {
  const create = useCreateComment(token);
  const form = useForm<CreateCommentInput>({ resolver: zodResolver(CreateCommentSchema), defaultValues: { body: '' } });
  const body = form.watch('body') ?? '';
  const used = characterCount(body);
  const submit = form.handleSubmit((values) =>
    create.mutate(values, {
      onSuccess: () => form.reset({ body: '' }),
      onError: (e) => form.setError('body', { message: e instanceof ApiError ? e.message : 'Your comment did not go through. Try again.' }),
    }),
  );
  return (
    <form onSubmit={submit} noValidate>
      <TextAreaField
        label="Leave a comment"
        rows={3}
        error={form.formState.errors.body?.message}
        hint={
          <span className={`tabular ${used > COMMENT_MAX ? 'font-bold text-clay' : ''}`}>
            {used.toLocaleString('en-US')} of {COMMENT_MAX.toLocaleString('en-US')} characters · plain text
          </span>
        }
        {...form.register('body')}
      />
      <div className="mt-3 flex justify-end">
        <Button type="submit" pending={create.isPending}>
          Post comment
        </Button>
      </div>
    </form>
  );
}
