import { spawn, type ChildProcess } from 'node:child_process';
import { createInterface } from 'node:readline';
import { formatLogLine } from './log-line-format.js';

/** A child Node process running one of our entry files under tsx, its log lines shown on this console. */
export interface ServiceProcess {
  name: string;
  child: ChildProcess;
  /** Resolves with the exit code (or the signal's name) when the process ends. */
  exited: Promise<number | string>;
}

export function startService(name: string, entry: string, root: string, env: NodeJS.ProcessEnv): ServiceProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', entry], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] });
  for (const stream of [child.stdout!, child.stderr!]) {
    createInterface({ input: stream }).on('line', (line) => console.log(formatLogLine(name, line)));
  }
  const exited = new Promise<number | string>((resolve) => {
    child.on('exit', (code, signal) => resolve(code ?? signal ?? 'unknown'));
    child.on('error', (err) => {
      console.log(formatLogLine(name, `could not start: ${err.message}`));
      resolve('spawn-error');
    });
  });
  return { name, child, exited };
}

/** Asks a service to stop (SIGTERM) and kills it when it has not ended within graceMs. */
export async function stopService(service: ServiceProcess, graceMs = 10_000): Promise<void> {
  if (service.child.exitCode !== null || service.child.signalCode !== null) return;
  service.child.kill('SIGTERM');
  const timer = setTimeout(() => service.child.kill('SIGKILL'), graceMs);
  await service.exited;
  clearTimeout(timer);
}
