import type { BrowserContext } from 'playwright-core';

/** Every URL a browser context asked for, including WebSocket connections. */
export interface RequestLog {
  readonly urls: readonly string[];
  /** The URLs that left the loopback host: the app must work offline, so this should always be empty. */
  outsideLoopback(): string[];
}

/** Network-free schemes: the browser answers them itself. */
const localSchemes = new Set(['data:', 'blob:', 'about:']);

export function recordRequests(context: BrowserContext): RequestLog {
  const urls: string[] = [];
  context.on('request', (request) => urls.push(request.url()));
  context.on('page', (page) => page.on('websocket', (socket) => urls.push(socket.url())));
  return {
    urls,
    outsideLoopback: () => urls.filter((url) => !isLoopback(url)),
  };
}

function isLoopback(url: string): boolean {
  const parsed = new URL(url);
  return localSchemes.has(parsed.protocol) || parsed.hostname === '127.0.0.1';
}
