import { randomBytes } from 'node:crypto';

/** Everything the API reads from its environment, with the defaults documented in the README. */
export interface ApiConfig {
  production: boolean;
  host: string;
  port: number;
  databaseUrl: string;
  sessionSecret: string;
  logLevel: string;
  /** Folder of the built Angular app; when absent, the server explains how to build it. */
  webDir: string | null;
  /** Failed sign-ins allowed per client address and e-mail within loginWindowMs; the next one gets 429. */
  loginLimit: number;
  loginWindowMs: number;
  /** Express "trust proxy" setting: false, a hop count or a list of addresses. */
  trustProxy: boolean | number | string;
  /** Served over HTTPS (directly or by a proxy): adds HSTS and upgrade-insecure-requests. */
  https: boolean;
}

type Env = Record<string, string | undefined>;

export function integerFrom(env: Env, name: string, fallback: number, min = 0): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value < min) throw new Error(`${name} must be a whole number of at least ${min}, not "${raw}".`);
  return value;
}

function booleanFrom(env: Env, name: string, fallback: boolean): boolean {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  if (['1', 'true', 'yes', 'on'].includes(raw.toLowerCase())) return true;
  if (['0', 'false', 'no', 'off'].includes(raw.toLowerCase())) return false;
  throw new Error(`${name} must be true or false, not "${raw}".`);
}

function trustProxyFrom(raw: string | undefined): boolean | number | string {
  if (raw === undefined || raw === '' || raw === 'false') return false;
  if (raw === 'true') return true;
  return /^\d+$/.test(raw) ? Number(raw) : raw;
}

function sessionSecretFrom(env: Env, production: boolean): string {
  const secret = env.CONSERVA_SESSION_SECRET;
  if (secret) {
    if (secret.length < 32) throw new Error('CONSERVA_SESSION_SECRET must be at least 32 characters long.');
    return secret;
  }
  if (production) throw new Error('CONSERVA_SESSION_SECRET is required when NODE_ENV=production.');
  // Development without a secret: sessions last as long as this process (npm start passes a kept one).
  return randomBytes(32).toString('hex');
}

export function loadConfig(env: Env = process.env): ApiConfig {
  const production = env.NODE_ENV === 'production';
  const databaseUrl = env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set (npm start sets it for the private cluster).');
  return {
    production,
    host: env.CONSERVA_HOST || '127.0.0.1',
    port: integerFrom(env, 'CONSERVA_PORT', 8470),
    databaseUrl,
    sessionSecret: sessionSecretFrom(env, production),
    logLevel: env.CONSERVA_LOG_LEVEL || 'info',
    webDir: env.CONSERVA_WEB_DIR || null,
    loginLimit: integerFrom(env, 'CONSERVA_LOGIN_LIMIT', 5, 1),
    loginWindowMs: integerFrom(env, 'CONSERVA_LOGIN_WINDOW_SECONDS', 60, 1) * 1000,
    trustProxy: trustProxyFrom(env.CONSERVA_TRUST_PROXY),
    https: booleanFrom(env, 'CONSERVA_HTTPS', false),
  };
}
