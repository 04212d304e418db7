import path from 'node:path';
import { z } from 'zod';

// Parsed once at start-up; a bad or missing value stops the server with every problem listed.
const EnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  DATA_DIR: z.string().default('./data'),
  UPLOADS_DIR: z.string().default('./uploads'),
  APP_ORIGIN: z
    .url({ message: 'APP_ORIGIN must be a full origin such as https://whorlbook.example' })
    .optional()
    .transform((v) => (v ? new URL(v).origin : undefined)),
  SMTP_URL: z.string().optional(),
  MAIL_FROM: z.string().default('Whorlbook <hello@whorlbook.local>'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).optional(),
  SEED_DEMO: z
    .enum(['true', 'false'])
    .default('true')
    .transform((v) => v === 'true'),
});

export type Env = z.infer<typeof EnvSchema> & { dataDir: string; uploadsDir: string };

export function parseEnv(source: Record<string, string | undefined> = process.env): Env {
  const cleaned = Object.fromEntries(Object.entries(source).filter(([, v]) => v !== undefined && v !== ''));
  const result = EnvSchema.safeParse(cleaned);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.') || '(env)'}: ${i.message}`);
    throw new Error(`Whorlbook cannot start; fix these settings:\n${lines.join('\n')}`);
  }
  const env = result.data;
  return { ...env, dataDir: path.resolve(env.DATA_DIR), uploadsDir: path.resolve(env.UPLOADS_DIR) };
}
