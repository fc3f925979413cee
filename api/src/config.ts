import { randomBytes } from 'node:crypto';
import type { AllowanceLimits } from '../../shared/schemas/allowance.js';

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
  /** Largest recording upload in bytes. */
  uploadLimitBytes: number;
  /** The address people open the app at; links in e-mails start with it. */
  publicUrl: string;
  /** Outgoing mail server (smtp://host:port); null sends no e-mail. */
  smtpUrl: string | null;
  mailFrom: string;
  /** Limits a team gets until an admin changes them. */
  allowanceDefaults: AllowanceLimits;
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

/** The address of the app as people open it (CONSERVA_PUBLIC_URL, else the listening address). */
export function publicUrlFrom(env: Env): string {
  const explicit = env.CONSERVA_PUBLIC_URL;
  if (explicit) return explicit.endsWith('/') ? explicit : `${explicit}/`;
  const host = env.CONSERVA_HOST || '127.0.0.1';
  const shown = host === '0.0.0.0' || host === '::' ? 'localhost' : host.includes(':') ? `[${host}]` : host;
  return `http://${shown}:${integerFrom(env, 'CONSERVA_PORT', 8470)}/`;
}

/** The default local mailbox port (ops/mailbox.ts listens there in development). */
export const defaultMailboxPort = 2525;

/**
 * Outgoing mail: CONSERVA_SMTP_URL, else the local mailbox in development and tests, else none (production
 * without a mail server sends nothing and says so in the log).
 */
export function smtpUrlFrom(env: Env, production: boolean): string | null {
  if (env.CONSERVA_SMTP_URL === 'off') return null;
  if (env.CONSERVA_SMTP_URL) return env.CONSERVA_SMTP_URL;
  return production ? null : `smtp://127.0.0.1:${integerFrom(env, 'CONSERVA_MAILBOX_PORT', defaultMailboxPort, 1)}`;
}

export function mailFromOf(env: Env): string {
  return env.CONSERVA_MAIL_FROM || 'Conserva <conserva@localhost>';
}

/** Allowance a team starts with: 10 CPU hours a month, 2 sweeps at once, 50 million subsets per sweep. */
export function allowanceDefaultsFrom(env: Env): AllowanceLimits {
  return {
    cpuSecondsPerMonth: integerFrom(env, 'CONSERVA_DEFAULT_CPU_SECONDS', 36_000),
    sweepsAtOnce: integerFrom(env, 'CONSERVA_DEFAULT_SWEEPS_AT_ONCE', 2),
    subsetsPerSweep: integerFrom(env, 'CONSERVA_DEFAULT_SUBSETS_PER_SWEEP', 50_000_000),
  };
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
    uploadLimitBytes: integerFrom(env, 'CONSERVA_UPLOAD_LIMIT_MB', 20, 1) * 1024 * 1024,
    publicUrl: publicUrlFrom(env),
    smtpUrl: smtpUrlFrom(env, production),
    mailFrom: mailFromOf(env),
    allowanceDefaults: allowanceDefaultsFrom(env),
  };
}
