import { randomBytes } from 'node:crypto';
import type { MikroORM } from '@mikro-orm/postgresql';
import type { Role, SessionState } from '../../shared/schemas/session.js';
import { hashPassword } from '../../api/src/auth/password-hash.js';
import { Team } from '../../api/src/entities/team.js';
import { User } from '../../api/src/entities/user.js';

export interface TeamWithUsers {
  team: Team;
  admin: User;
  analyst: User;
  viewer: User;
  /** The one password of all three users. */
  password: string;
}

function slug(label: string): string {
  return label.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 30) || 'team';
}

/**
 * A team named after the label with one user per role. Names and e-mails carry a random part, so every call
 * (and every test file) gets rows of its own.
 */
export async function createTeamWithUsers(orm: MikroORM, label: string): Promise<TeamWithUsers> {
  const unique = randomBytes(4).toString('hex');
  const password = `pw-${randomBytes(9).toString('base64url')}`;
  const passwordHash = await hashPassword(password);
  const em = orm.em.fork();
  const team = em.create(Team, { name: `${label} ${unique}` });
  const user = (role: Role) =>
    em.create(User, { email: `${role}.${slug(label)}.${unique}@test.example`, name: `${label} ${role}`, role, team, passwordHash });
  const result = { team, admin: user('admin'), analyst: user('analyst'), viewer: user('viewer'), password };
  await em.flush();
  return result;
}

export interface RequestOptions {
  /** JSON body; sent with Content-Type application/json. */
  json?: unknown;
  /** Multipart body (fetch sets the Content-Type with its boundary). */
  form?: FormData;
  headers?: Record<string, string>;
  /** Leave out the X-XSRF-TOKEN header (to show that the server refuses such requests). */
  withoutCsrf?: boolean;
}

const statusesWithoutBody = new Set([101, 103, 204, 205, 304]);

/**
 * The response after its body has fully arrived. The server stores session changes before it ends the
 * response, so only then may the next request rely on them (fetch itself resolves at the headers).
 */
async function completed(response: Response): Promise<Response> {
  const body = await response.arrayBuffer();
  const init = { status: response.status, statusText: response.statusText, headers: response.headers };
  return new Response(statusesWithoutBody.has(response.status) ? null : body, init);
}

/**
 * A small HTTP client that keeps cookies like a browser and, like Angular, echoes the XSRF-TOKEN cookie in
 * the X-XSRF-TOKEN header of state-changing requests.
 */
export class TestAgent {
  readonly cookies = new Map<string, string>();

  constructor(readonly baseUrl: string) {}

  cookieHeader(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
  }

  private keepCookies(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const [pair, ...attributes] = line.split(';');
      const eq = pair!.indexOf('=');
      const name = pair!.slice(0, eq).trim();
      const value = pair!.slice(eq + 1).trim();
      const expired = attributes.some((a) => /^\s*expires=thu, 01 jan 1970/i.test(a)) || value === '';
      if (expired) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  async request(method: string, path: string, options: RequestOptions = {}): Promise<Response> {
    const headers: Record<string, string> = { Accept: 'application/json', ...options.headers };
    if (this.cookies.size) headers.Cookie = this.cookieHeader();
    const token = this.cookies.get('XSRF-TOKEN');
    if (token && !options.withoutCsrf && !['GET', 'HEAD'].includes(method)) headers['X-XSRF-TOKEN'] = decodeURIComponent(token);
    let body: string | FormData | undefined;
    if (options.json !== undefined) {
      headers['Content-Type'] = 'application/json';
      body = JSON.stringify(options.json);
    } else if (options.form) {
      body = options.form;
    }
    const response = await fetch(new URL(path, this.baseUrl), { method, headers, body, redirect: 'manual' });
    this.keepCookies(response);
    return completed(response);
  }

  get(path: string, options?: RequestOptions) {
    return this.request('GET', path, options);
  }
  post(path: string, json?: unknown, options?: RequestOptions) {
    return this.request('POST', path, { ...options, json });
  }
  postForm(path: string, form: FormData, options?: RequestOptions) {
    return this.request('POST', path, { ...options, form });
  }
  put(path: string, json?: unknown, options?: RequestOptions) {
    return this.request('PUT', path, { ...options, json });
  }
  patch(path: string, json?: unknown, options?: RequestOptions) {
    return this.request('PATCH', path, { ...options, json });
  }
  delete(path: string, options?: RequestOptions) {
    return this.request('DELETE', path, options);
  }
}

/** A fresh agent that has fetched GET /api/session (so it holds the anti-forgery token), signed in nobody. */
export async function anonymousAgent(baseUrl: string): Promise<TestAgent> {
  const agent = new TestAgent(baseUrl);
  const response = await agent.get('/api/session');
  if (!response.ok) throw new Error(`GET /api/session answered ${response.status}`);
  return agent;
}

/** Signs in as the app does (GET /api/session, then POST /api/session with the token); fails loudly otherwise. */
export async function signIn(baseUrl: string, email: string, password: string): Promise<TestAgent> {
  const agent = await anonymousAgent(baseUrl);
  const response = await agent.post('/api/session', { email, password });
  if (response.status !== 200) throw new Error(`Sign-in as ${email} answered ${response.status}: ${await response.text()}`);
  const state = (await response.json()) as SessionState;
  if (state.user?.email !== email.toLowerCase()) throw new Error(`Sign-in as ${email} returned ${JSON.stringify(state)}`);
  return agent;
}
