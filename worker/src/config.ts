/** What the worker process reads from its environment. */
export interface WorkerConfig {
  databaseUrl: string;
  logLevel: string;
}

export function loadWorkerConfig(env: Record<string, string | undefined> = process.env): WorkerConfig {
  const databaseUrl = env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set (npm start sets it for the private cluster).');
  return { databaseUrl, logLevel: env.CONSERVA_LOG_LEVEL || 'info' };
}
