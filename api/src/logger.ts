import { pino, type Logger } from 'pino';

/** The process's root logger: JSON lines on stdout (npm start formats them for the console). */
export function createLogger(level: string, service: string): Logger {
  return pino({
    level,
    base: { service },
    redact: ['req.headers.cookie', 'req.headers["x-xsrf-token"]', 'res.headers["set-cookie"]'],
  });
}
