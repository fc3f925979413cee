import { execFile } from 'node:child_process';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../..');

export interface CliRun {
  status: number;
  stdout: string;
  stderr: string;
}

/**
 * Runs the command line as scripts outside the project do (through tsx, as the npm script does), from the
 * project root; never rejects: a failing run answers with its exit status.
 */
export function runConserva(args: string[], options: { timeoutMs?: number } = {}): Promise<CliRun> {
  return new Promise((resolve) => {
    execFile(
      process.execPath,
      ['--import', 'tsx', path.join(root, 'worker/src/cli/main.ts'), ...args],
      { cwd: root, encoding: 'utf8', timeout: options.timeoutMs ?? 60_000, maxBuffer: 64 * 1024 * 1024 },
      (error, stdout, stderr) => resolve({ status: error ? Number(error.code ?? 1) : 0, stdout, stderr }),
    );
  });
}
