import { pino, type Logger } from 'pino';

export function createLogger(level: string): Logger {
  return pino({
    level,
    base: { app: 'biasproof' },
    // Never write secrets or session material to the log.
    redact: [
      'req.headers.cookie',
      'req.headers["x-csrf-token"]',
      'res.headers["set-cookie"]',
      'res.headers["x-csrf-token"]',
      '*.password',
    ],
  });
}
