import type { Env } from '../env.js';
import type { Logger } from './logger.js';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(message: MailMessage): Promise<void>;
  /** Present only while the built-in local fake SMTP server is in use (SMTP_URL unset). */
  outbox?: () => Promise<Array<MailMessage & { date: string }>>;
  close(): Promise<void>;
}

// Foundation placeholder transport: records nothing and sends nothing until the accounts work lands the real
// nodemailer + local SMTP fake here (see DEVELOPERS.md "Mail").
export async function createMailer(_env: Env, logger: Logger): Promise<Mailer> {
  return {
    async send(message) {
      logger.info({ to: message.to, subject: message.subject }, 'mail (no transport configured yet)');
    },
    async close() {},
  };
}
