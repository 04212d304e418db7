import type { TestContext } from '../../setup/test-app.js';
import type { OutboxMessage } from '../../../server/lib/mail.js';

/**
 * Waits until the local mail fake has received a message matching `match` (some mail goes out after the HTTP
 * answer, on purpose) and returns it. Fails with what did arrive, so a missing e-mail is easy to read.
 */
export async function waitForMail(t: TestContext, match: (m: OutboxMessage) => boolean, { skip = 0, timeoutMs = 5000 } = {}): Promise<OutboxMessage> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const all = await t.mailer.outbox!();
    // `skip`: how many matching messages were there before, so an earlier one is never mistaken for the new one.
    const matching = all.filter(match);
    if (matching.length > skip) return matching.at(-1)!;
    if (Date.now() > until) throw new Error(`no matching e-mail arrived; the outbox holds: ${JSON.stringify(all.map((m) => [m.to, m.subject]))}`);
    await new Promise((r) => setTimeout(r, 20));
  }
}

export const countMail = async (t: TestContext, match: (m: OutboxMessage) => boolean) => (await t.mailer.outbox!()).filter(match).length;

export const mailTo = (to: string, subject: RegExp) => (m: OutboxMessage) => m.to === to && subject.test(m.subject);

/** The token from the first link in the plain-text part, checked to be an absolute link to `pathname`. */
export function tokenFrom(message: OutboxMessage, pathname: string): string {
  const url = message.text.match(/https?:\/\/\S+/)?.[0];
  if (!url) throw new Error(`no link in: ${message.text}`);
  const parsed = new URL(url);
  if (parsed.pathname !== pathname) throw new Error(`link goes to ${parsed.pathname}, not ${pathname}`);
  const token = parsed.searchParams.get('token');
  if (!token) throw new Error(`link has no token: ${url}`);
  return token;
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
