import { WebSocket } from 'ws';
import { liveServerMessageSchema, type LiveServerMessage } from '../../shared/schemas/live-message.js';
import type { TestAgent } from './fixtures.js';

export interface ReceivedMessage {
  at: number;
  message: LiveServerMessage;
}

export interface LiveTestClient {
  received: ReceivedMessage[];
  /** Resolves with the close code when the server (or close()) ends the socket. */
  closed: Promise<number>;
  subscribe(sweepId: string): void;
  /** Resolves with the first message (already received or arriving) that matches. */
  waitFor<T extends LiveServerMessage>(what: string, match: (message: LiveServerMessage) => message is T, timeoutMs?: number): Promise<T>;
  waitFor(what: string, match: (message: LiveServerMessage) => boolean, timeoutMs?: number): Promise<LiveServerMessage>;
  close(): void;
}

/** Opens /ws with the agent's session cookie, as the browser would; every message is checked against the schema. */
export async function openLiveClient(baseUrl: string, agent: TestAgent | null, origin = baseUrl): Promise<LiveTestClient> {
  const url = baseUrl.replace(/^http/, 'ws') + '/ws';
  const socket = new WebSocket(url, { headers: { Origin: origin, ...(agent ? { Cookie: agent.cookieHeader() } : {}) } });
  await new Promise<void>((resolve, reject) => {
    socket.once('open', () => resolve());
    socket.once('unexpected-response', (_req, res) => reject(new Error(`live socket refused: ${res.statusCode}`)));
    socket.once('error', reject);
  });
  const received: ReceivedMessage[] = [];
  const closed = new Promise<number>((resolve) => socket.once('close', (code) => resolve(code)));
  const waiters: { match: (m: LiveServerMessage) => boolean; resolve: (m: LiveServerMessage) => void }[] = [];
  socket.on('message', (data) => {
    const message = liveServerMessageSchema.parse(JSON.parse(data.toString()));
    received.push({ at: Date.now(), message });
    for (const waiter of [...waiters]) {
      if (waiter.match(message)) {
        waiters.splice(waiters.indexOf(waiter), 1);
        waiter.resolve(message);
      }
    }
  });
  return {
    received,
    closed,
    subscribe(sweepId) {
      socket.send(JSON.stringify({ type: 'subscribe', sweepId }));
    },
    waitFor(what: string, match: (message: LiveServerMessage) => boolean, timeoutMs = 60_000) {
      const already = received.find((r) => match(r.message));
      if (already) return Promise.resolve(already.message);
      return new Promise<LiveServerMessage>((resolve, reject) => {
        const timer = setTimeout(() => reject(new Error(`no live message (${what}) within ${timeoutMs} ms`)), timeoutMs);
        waiters.push({ match, resolve: (m) => (clearTimeout(timer), resolve(m)) });
      });
    },
    close() {
      socket.terminate();
    },
  } as LiveTestClient;
}

/** Whether the socket refuses to open (the HTTP status of the refusal), for the negative cases. */
export function liveRefusal(baseUrl: string, headers: Record<string, string>): Promise<number> {
  return new Promise((resolve, reject) => {
    const socket = new WebSocket(baseUrl.replace(/^http/, 'ws') + '/ws', { headers });
    socket.once('unexpected-response', (_req, res) => {
      resolve(res.statusCode ?? 0);
      socket.terminate();
    });
    socket.once('open', () => {
      socket.terminate();
      reject(new Error('the live socket opened'));
    });
    socket.once('error', () => undefined);
  });
}
