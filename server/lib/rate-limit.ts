import type { Request, RequestHandler, Response } from 'express';
import { rateLimit, ipKeyGenerator, type RateLimitInfo } from 'express-rate-limit';
import { z } from 'zod';
import { normalizeEmail } from '../services/users.js';

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;

// Every limit is "so many per window" and can be tuned by a self-hoster; 0 turns that limit off (e.g. behind a
// proxy that limits on its own). The defaults stop a script long before a person notices anything: a person
// mistypes a password a handful of times, signs up once, asks for a reset link once or twice.
// Sources: OWASP Authentication Cheat Sheet ("Protect against automated attacks", "Account lockout") and
// NIST SP 800-63B §5.2.2 (rate limiting, at most 100 consecutive failures per account); figures are our choice.
const count = (fallback: number) => z.coerce.number({ message: 'must be a whole number (0 turns the limit off)' }).int().min(0).max(1_000_000).default(fallback);
const SettingsSchema = z.object({
  RATE_LIMIT_SIGNIN_PER_ACCOUNT: count(10), // failed sign-ins per account in 15 minutes
  RATE_LIMIT_SIGNIN_PER_IP: count(30), // failed sign-ins per IP address in 15 minutes (any accounts)
  RATE_LIMIT_SIGNUP_PER_IP: count(20), // sign-ups per IP address per hour
  RATE_LIMIT_RESET_PER_IP: count(20), // password-reset requests per IP address per hour
  RATE_LIMIT_RESET_PER_ACCOUNT: count(5), // password-reset requests per e-mail address per hour
  RATE_LIMIT_RESEND_PER_ACCOUNT: count(5), // verification e-mails re-sent per member per hour
  RATE_LIMIT_PASSWORD_CHANGE_PER_ACCOUNT: count(10), // wrong current passwords per member in 15 minutes
});
export type RateLimitSettings = z.infer<typeof SettingsSchema>;

/** Read from the environment (and .env) when an app is built; a bad value stops start-up with its name. */
export function rateLimitSettings(source: Record<string, string | undefined> = process.env): RateLimitSettings {
  const picked = Object.fromEntries(Object.keys(SettingsSchema.shape).flatMap((k) => (source[k] ? [[k, source[k]]] : [])));
  const result = SettingsSchema.safeParse(picked);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Whorlbook cannot start; fix these settings:\n${lines.join('\n')}`);
  }
  return result.data;
}

function waitPhrase(seconds: number) {
  if (seconds < 90) return `${Math.max(1, seconds)} seconds`;
  const minutes = Math.ceil(seconds / 60);
  return minutes === 1 ? '1 minute' : `${minutes} minutes`;
}

interface LimiterOptions {
  limit: number;
  windowMs: number;
  /** Who is counted: the client IP, or an account taken from the (already validated) request. */
  key: 'ip' | ((req: Request, res: Response) => string | undefined);
  /** Count only requests that fail (status >= 400), e.g. wrong passwords. */
  failuresOnly?: boolean;
  /** The sentence in the 429 answer; "{wait}" becomes e.g. "14 minutes". */
  message: string;
}

const pass: RequestHandler = (_req, _res, next) => next();

/**
 * One express-rate-limit instance with its own in-memory store. Each createApp() builds its own limiters, so
 * state never leaks between server tests; one process serves one database, so memory is the right store.
 */
export function limiter({ limit, windowMs, key, failuresOnly, message }: LimiterOptions): RequestHandler {
  if (limit === 0) return pass;
  return rateLimit({
    windowMs,
    limit,
    skipSuccessfulRequests: failuresOnly ?? false,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator:
      key === 'ip'
        ? (req) => `ip:${ipKeyGenerator(req.ip ?? 'unknown')}`
        : (req, res) => {
            const k = key(req, res);
            // No account to count against (bad input): fall back to the address so the request is still counted.
            return k ? `acct:${k}` : `ip:${ipKeyGenerator(req.ip ?? 'unknown')}`;
          },
    handler(req, res) {
      const reset = (req as Request & { rateLimit?: RateLimitInfo }).rateLimit?.resetTime;
      const seconds = reset ? Math.ceil((reset.getTime() - Date.now()) / 1000) : Math.ceil(windowMs / 1000);
      // express-rate-limit has already set Retry-After (seconds) before calling this.
      res.status(429).json({ error: message.replace('{wait}', waitPhrase(seconds)) });
    },
  });
}

export interface AuthLimiters {
  signInAccount: RequestHandler;
  signInIp: RequestHandler;
  signUpIp: RequestHandler;
  resetIp: RequestHandler;
  resetAccount: RequestHandler;
  resendAccount: RequestHandler;
  passwordChangeAccount: RequestHandler;
}

const bodyEmail = (req: Request) => {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' && email ? normalizeEmail(email) : undefined;
};
const signedInId = (_req: Request, res: Response) => res.locals.user?.id;

export function authLimiters(s: RateLimitSettings = rateLimitSettings()): AuthLimiters {
  return {
    signInAccount: limiter({
      limit: s.RATE_LIMIT_SIGNIN_PER_ACCOUNT,
      windowMs: 15 * MINUTE,
      key: bodyEmail,
      failuresOnly: true,
      message: 'Too many wrong passwords for this account. Wait {wait} and try again, or reset your password from "Forgot your password?".',
    }),
    signInIp: limiter({
      limit: s.RATE_LIMIT_SIGNIN_PER_IP,
      windowMs: 15 * MINUTE,
      key: 'ip',
      failuresOnly: true,
      message: 'Too many failed sign-ins from this network. Wait {wait} and try again.',
    }),
    signUpIp: limiter({
      limit: s.RATE_LIMIT_SIGNUP_PER_IP,
      windowMs: HOUR,
      key: 'ip',
      message: 'Too many new accounts were made from this network. Wait {wait} and try again.',
    }),
    resetIp: limiter({
      limit: s.RATE_LIMIT_RESET_PER_IP,
      windowMs: HOUR,
      key: 'ip',
      message: 'Too many password-reset requests from this network. Wait {wait} and try again.',
    }),
    resetAccount: limiter({
      limit: s.RATE_LIMIT_RESET_PER_ACCOUNT,
      windowMs: HOUR,
      key: bodyEmail,
      message: 'We have already sent several reset links for that address. Check your inbox and spam folder, or wait {wait} to ask again.',
    }),
    resendAccount: limiter({
      limit: s.RATE_LIMIT_RESEND_PER_ACCOUNT,
      windowMs: HOUR,
      key: signedInId,
      message: 'We have already sent several confirmation e-mails. Check your inbox and spam folder, or wait {wait} to ask again.',
    }),
    passwordChangeAccount: limiter({
      limit: s.RATE_LIMIT_PASSWORD_CHANGE_PER_ACCOUNT,
      windowMs: 15 * MINUTE,
      key: signedInId,
      failuresOnly: true,
      message: 'Too many wrong current passwords. Wait {wait} and try again, or sign out and use "Forgot your password?".',
    }),
  };
}
