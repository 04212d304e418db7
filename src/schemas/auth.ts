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
