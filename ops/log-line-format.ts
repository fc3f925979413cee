const levelNames: Record<number, string> = { 10: 'TRACE', 20: 'DEBUG', 30: 'INFO', 40: 'WARN', 50: 'ERROR', 60: 'FATAL' };

interface PinoLine {
  level?: number;
  time?: number;
  msg?: string;
  responseTime?: number;
  err?: { message?: string; stack?: string };
}

function clock(time: number | undefined): string {
  return new Date(time ?? Date.now()).toTimeString().slice(0, 8);
}

/** Turns one pino JSON line of a child process into a short console line; other text passes through. */
export function formatLogLine(service: string, line: string): string {
  const tag = service.padEnd(6);
  let entry: PinoLine;
  try {
    entry = JSON.parse(line) as PinoLine;
  } catch {
    return `${clock(undefined)} ${tag} ${line}`;
  }
  if (typeof entry !== 'object' || entry === null || typeof entry.level !== 'number') return `${clock(undefined)} ${tag} ${line}`;
  const level = (levelNames[entry.level] ?? String(entry.level)).padEnd(5);
  const took = typeof entry.responseTime === 'number' ? ` (${entry.responseTime} ms)` : '';
  const error = entry.err?.stack ? `\n${entry.err.stack}` : entry.err?.message ? `: ${entry.err.message}` : '';
  return `${clock(entry.time)} ${tag} ${level} ${entry.msg ?? ''}${took}${error}`;
}
