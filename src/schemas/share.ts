import { z } from 'zod';

// The showcase (shared finished-project page): comments, cheers, reports and the comment e-mail setting.
// Shared by the API routes and the forms.

export const COMMENT_MAX = 2000;
export const REPORT_REASON_MAX = 500;

/** Characters as a person counts them: an emoji is one, not two UTF-16 units. */
export const characterCount = (s: string) => [...s].length;

const formatCount = (n: number) => n.toLocaleString('en-US');

/** A comment is plain text, kept exactly as typed (never trimmed, escaped or rewritten) and shown only as text. */
export const CommentBodySchema = z
  .string({ message: 'Write a comment first.' })
  .refine((s) => s.trim().length > 0, { message: 'Write a comment first.' })
  .superRefine((s, ctx) => {
    const n = characterCount(s);
    if (n > COMMENT_MAX) {
      ctx.addIssue({
        code: 'custom',
        message: `A comment can be at most ${formatCount(COMMENT_MAX)} characters; this one has ${formatCount(n)}. Shorten it a little and send it again.`,
      });
    }
  });

export const CreateCommentSchema = z.object({ body: CommentBodySchema }).strict();
export type CreateCommentInput = z.infer<typeof CreateCommentSchema>;

// The token in a path is only bounded here; a malformed one gets the same 404 as an unknown one, from the service.
const PathToken = z.string().max(100);
export const ShareTokenParamsSchema = z.object({ token: PathToken });
/** A comment is addressed only through its page's link, /share/:token/comments/:id, never by id alone. */
export const ShareCommentParamsSchema = z.object({
  token: PathToken,
  id: z.coerce.number({ message: 'That id is not a number.' }).int().positive(),
});
export type ShareCommentParams = z.infer<typeof ShareCommentParamsSchema>;

export const UpdateCommentSchema = z.object({ hidden: z.boolean({ message: 'Say whether the comment is hidden (true or false).' }) }).strict();

const Reason = z
  .string({ message: 'Say in a few words what is wrong.' })
  .trim()
  .min(3, { message: 'Say in a few words what is wrong.' })
  .max(REPORT_REASON_MAX, { message: `Keep the reason under ${REPORT_REASON_MAX} characters.` });

/**
 * A report names the page by its link token, with a comment id when it is about one comment on that page (what
 * the showcase page sends). `{ commentId }` alone is still taken, for the API's published shape, and finds the
 * comment only while its page is open and the comment shown.
 */
export const CreateReportSchema = z
  .object({
    shareToken: z.string().min(1, { message: 'Say which page this is about (its link).' }).max(100).optional(),
    commentId: z.number({ message: 'That comment id is not a number.' }).int().positive().optional(),
    reason: Reason,
  })
  .strict()
  .refine((v) => v.shareToken !== undefined || v.commentId !== undefined, {
    message: 'Say which page or comment this is about.',
    path: ['shareToken'],
  });
export type CreateReportInput = z.infer<typeof CreateReportSchema>;

export const ReportFormSchema = z.object({ reason: Reason });
export type ReportFormValues = z.infer<typeof ReportFormSchema>;

export const ResolveReportSchema = z.object({
  action: z.enum(['hide', 'dismiss'], { message: 'Choose "hide" or "dismiss".' }),
}).strict();

export const ReportStatusSchema = z.enum(['open', 'hidden', 'dismissed']);
export const ReportListQuerySchema = z.object({ status: z.enum(['open', 'handled', 'all']).default('open') });

export const ShareSettingsSchema = z.object({ notifyComments: z.boolean({ message: 'Say whether to send comment e-mails (true or false).' }) }).strict();
export type ShareSettings = z.infer<typeof ShareSettingsSchema>;

/** Share tokens are URL-safe random strings; anything else is answered 404 without touching the database. */
export const ShareTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{16,64}$/);
