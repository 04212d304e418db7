import { z } from 'zod';

// Password length follows NIST SP 800-63B §5.1.1 (at least 8; we ask 10) with a generous upper bound.
export const EmailSchema = z.email({ message: 'Enter an e-mail address like name@example.com.' }).max(254);
export const PasswordSchema = z
  .string()
  .min(10, { message: 'Use at least 10 characters for your password.' })
  .max(256, { message: 'Use at most 256 characters for your password.' });

export const SignInSchema = z.object({
  email: z.string().trim().pipe(EmailSchema),
  password: z.string().min(1, { message: 'Enter your password.' }).max(256),
});
export type SignInInput = z.infer<typeof SignInSchema>;

// A few passwords of 10+ characters that are among the first any guessing script tries. NIST SP 800-63B §5.1.1.2
// asks for a check against commonly used values; this short list (from memory) catches the worst without
// shipping a large list to the browser, and composition rules are deliberately not imposed (same section).
const COMMON_PASSWORDS = new Set([
  '1234567890',
  '12345678910',
  '0123456789',
  '1111111111',
  '0987654321',
  'qwertyuiop',
  'password12',
  'password123',
  'password1234',
  'iloveyou12',
  'qwerty1234',
  'qwerty12345',
  'abcdefghij',
  '1q2w3e4r5t',
  'whorlbook1',
  'whorlbook123',
  'crochet123',
  'amigurumi1',
]);

/** A password being set (sign-up, reset, change): the length rule plus no very common or single-character ones. */
export const NewPasswordSchema = PasswordSchema.refine((p) => !COMMON_PASSWORDS.has(p.toLowerCase()), {
  message: 'That password is one of the first ones people guess. Try a short sentence only you would write.',
}).refine((p) => new Set(p).size > 2, { message: 'Use more than one or two different characters.' });

export const DisplayNameSchema = z
  .string()
  .trim()
  .min(1, { message: 'Enter the name other makers will see.' })
  .max(60, { message: 'Keep your name to 60 characters or fewer.' });

export const SignUpSchema = z.object({
  displayName: DisplayNameSchema,
  email: z.string().trim().pipe(EmailSchema),
  password: NewPasswordSchema,
});
export type SignUpInput = z.infer<typeof SignUpSchema>;

// Tokens are 32 random bytes in base64url (43 characters); anything far from that shape is refused before any lookup.
export const TokenSchema = z
  .string({ message: 'The link is missing its token. Open the whole link from the e-mail.' })
  .trim()
  .regex(/^[A-Za-z0-9_-]{20,200}$/, { message: 'That link is not complete. Open the whole link from the e-mail.' });

export const VerifyEmailSchema = z.object({ token: TokenSchema });
export type VerifyEmailInput = z.infer<typeof VerifyEmailSchema>;

export const PasswordResetRequestSchema = z.object({ email: z.string().trim().pipe(EmailSchema) });
export type PasswordResetRequestInput = z.infer<typeof PasswordResetRequestSchema>;

export const PasswordResetConfirmSchema = z.object({ token: TokenSchema, password: NewPasswordSchema });
export type PasswordResetConfirmInput = z.infer<typeof PasswordResetConfirmSchema>;

export const PasswordChangeSchema = z
  .object({
    current: z.string().min(1, { message: 'Enter your current password.' }).max(256),
    next: NewPasswordSchema,
  })
  .refine((v) => v.current !== v.next, { path: ['next'], message: 'Choose a new password that differs from the current one.' });
export type PasswordChangeInput = z.infer<typeof PasswordChangeSchema>;

// Changing the sign-in address: the new address, and the password again (OWASP: re-authenticate first).
export const ChangeEmailSchema = z.object({
  email: z.string().trim().pipe(EmailSchema),
  password: z.string().min(1, { message: 'Enter your password to confirm.' }).max(256),
});
export type ChangeEmailInput = z.infer<typeof ChangeEmailSchema>;
export const ConfirmEmailChangeSchema = z.object({ token: TokenSchema });

// Deleting one's own account asks for the password again, so an unattended signed-in phone cannot do it.
export const DeleteAccountSchema = z.object({
  password: z.string().min(1, { message: 'Enter your password to confirm.' }).max(256),
});
export type DeleteAccountInput = z.infer<typeof DeleteAccountSchema>;

// The admin member list: ?query=&page=&sort= (sort is a column name, "-" in front for descending).
export const AdminUserSortSchema = z.enum(['name', '-name', 'email', '-email', 'projects', '-projects', 'lastSignIn', '-lastSignIn', 'created', '-created']);
export type AdminUserSort = z.infer<typeof AdminUserSortSchema>;
export const AdminUserListQuerySchema = z.object({
  query: z.string().trim().max(100, { message: 'Search for at most 100 characters.' }).default(''),
  page: z.coerce.number({ message: 'The page must be a number.' }).int().min(1, { message: 'Pages start at 1.' }).max(100_000).default(1),
  sort: AdminUserSortSchema.default('-created'),
});
export type AdminUserListQuery = z.infer<typeof AdminUserListQuerySchema>;

export const AdminSetRoleSchema = z.object({ role: z.enum(['member', 'admin'], { message: 'Choose "member" or "admin".' }) }).strict();
export type AdminSetRoleInput = z.infer<typeof AdminSetRoleSchema>;
