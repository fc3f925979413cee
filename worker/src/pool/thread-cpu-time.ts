import { readFileSync } from 'node:fs';

/** Linux reports per-thread user and system time in clock ticks of USER_HZ, 100 on every architecture Node runs on. */
const USER_HZ = 100;

/**
 * CPU seconds the calling thread has used so far, or null where the system does not say. Node 20 has no
 * per-thread CPU clock (process.cpuUsage counts every thread), so this reads Linux's own figure for the
 * calling thread: /proc/thread-self/schedstat (nanoseconds on the CPU), else /proc/thread-self/stat (utime +
 * stime in ticks). Synchronous reads run on the calling thread, so a worker thread reads its own entry.
 */
export function threadCpuSeconds(): number | null {
  try {
    const nanoseconds = Number(readFileSync('/proc/thread-self/schedstat', 'utf8').split(' ')[0]);
    if (Number.isFinite(nanoseconds)) return nanoseconds / 1e9;
  } catch {
    // No scheduler statistics in this kernel: try the tick counts.
  }
  try {
    const stat = readFileSync('/proc/thread-self/stat', 'utf8');
    // Fields after the command name, which is in parentheses and may contain spaces: utime and stime are fields 14, 15.
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    const ticks = Number(fields[11]) + Number(fields[12]);
    if (Number.isFinite(ticks)) return ticks / USER_HZ;
  } catch {
    // Not Linux.
  }
  return null;
}
