import type { IncomingMessage, Server } from 'node:http';
import type { Duplex } from 'node:stream';
import type { MikroORM } from '@mikro-orm/postgresql';
import type { RequestHandler, Response } from 'express';
import pg from 'pg';
import type { Logger } from 'pino';
import { WebSocket, WebSocketServer } from 'ws';
import { liveClientMessageSchema, type LiveServerMessage } from '../../../shared/schemas/live-message.js';
import { loadAuthUser } from '../auth/credentials-check.js';
import type { AuthUser } from '../auth/session-user.js';
import { teamScope } from '../auth/team-scope.js';
import { loadSweepForView, toSweepDetail, toSweepLeaderboard } from '../sweeps/sweep-views.js';
import { sweepEventChannel, sweepEventSchema, type SweepEvent } from './sweep-events.js';
import { SweepFeed } from './sweep-feed.js';

/** At most ten progress messages a second per sweep. */
const progressGapMs = 100;
/** A running sweep gets a progress message at least this often, even between worker reports. */
const progressHeartbeatMs = 1000;
const pingIntervalMs = 30_000;
/** A client this far behind (bytes not yet sent) is cut off rather than buffered without end. */
const maxBufferedBytes = 1024 * 1024;

interface LiveClient {
  socket: WebSocket;
  user: AuthUser;
  sweeps: Set<string>;
  alive: boolean;
}

function mayWatch(user: AuthUser, teamId: string): boolean {
  return user.role === 'admin' || user.teamId === teamId;
}

function sameOrigin(req: IncomingMessage): boolean {
  const origin = req.headers.origin;
  if (!origin) return true;
  try {
    return new URL(origin).host === req.headers.host;
  } catch {
    return false;
  }
}

function refuse(socket: Duplex, status: string): void {
  socket.write(`HTTP/1.1 ${status}\r\nConnection: close\r\nContent-Length: 0\r\n\r\n`);
  socket.destroy();
}

/**
 * The live view's server side: WebSockets at /ws on the app's HTTP server, authenticated by the session
 * cookie (the app's own session middleware runs on the upgrade request) and refused from other origins.
 * One PostgreSQL connection LISTENs for sweep events from workers and the API; each is forwarded only to
 * clients subscribed to that sweep whose team may see it (admins: every team).
 */
export class LiveHub {
  private readonly wss = new WebSocketServer({ noServer: true, maxPayload: 16 * 1024 });
  private readonly clients = new Set<LiveClient>();
  private readonly feeds = new Map<string, SweepFeed>();
  private readonly pendingProgress = new Map<string, NodeJS.Timeout>();
  /**
   * Per sweep, the subscriptions and events being turned into messages, one after the other: messages keep the
   * events' order, and an event that arrives while a subscription reads the sweep is forwarded after its state.
   */
  private readonly eventChains = new Map<string, Promise<void>>();
  private listener: pg.Client | null = null;
  private listening: Promise<void> | null = null;
  private closed = false;
  private readonly timers: NodeJS.Timeout[] = [];

  constructor(
    private readonly orm: MikroORM,
    private readonly sessionMiddleware: RequestHandler,
    private readonly databaseUrl: string,
    private readonly logger: Logger,
  ) {}

  /** Serves /ws on the server; starts listening for sweep events. */
  attach(server: Server): void {
    server.on('upgrade', (req, socket, head) => void this.upgrade(req, socket, head));
    this.listening = this.listen();
    this.timers.push(setInterval(() => this.heartbeat(), 250));
    this.timers.push(setInterval(() => this.ping(), pingIntervalMs));
  }

  /** Closes every socket of a user (at sign-out, or when an admin changes or removes the account). */
  closeUser(userId: string, reason = 'signed out'): void {
    for (const client of this.clients) if (client.user.id === userId) client.socket.close(4001, reason);
  }

  async close(): Promise<void> {
    if (this.closed) return;
    this.closed = true;
    for (const timer of this.timers) clearInterval(timer);
    for (const timer of this.pendingProgress.values()) clearTimeout(timer);
    for (const client of this.clients) client.socket.terminate();
    this.wss.close();
    await this.listener?.end().catch(() => undefined);
    await this.listening?.catch(() => undefined);
  }

  private async upgrade(req: IncomingMessage, socket: Duplex, head: Buffer): Promise<void> {
    const path = (req.url ?? '').split('?')[0];
    if (path !== '/ws') return refuse(socket, '404 Not Found');
    if (!sameOrigin(req)) return refuse(socket, '403 Forbidden');
    try {
      const userId = await new Promise<string | undefined>((resolve, reject) => {
        const request = req as IncomingMessage & { session?: { passport?: { user?: string } } };
        this.sessionMiddleware(request as never, {} as Response, (err?: unknown) => (err ? reject(err) : resolve(request.session?.passport?.user)));
      });
      const user = userId ? await loadAuthUser(this.orm.em.fork(), userId) : null;
      if (!user) return refuse(socket, '401 Unauthorized');
      this.wss.handleUpgrade(req, socket, head, (ws) => this.connect(ws, user));
    } catch (err) {
      this.logger.warn({ err }, 'live socket upgrade failed');
      refuse(socket, '500 Internal Server Error');
    }
  }

  private connect(socket: WebSocket, user: AuthUser): void {
    const client: LiveClient = { socket, user, sweeps: new Set(), alive: true };
    this.clients.add(client);
    socket.on('pong', () => (client.alive = true));
    socket.on('message', (data) => void this.receive(client, data.toString()));
    socket.on('close', () => this.disconnect(client));
    socket.on('error', () => socket.terminate());
  }

  private disconnect(client: LiveClient): void {
    this.clients.delete(client);
    for (const sweepId of client.sweeps) this.dropFeedIfUnwatched(sweepId);
  }

  private send(client: LiveClient, message: LiveServerMessage): void {
    if (client.socket.readyState !== WebSocket.OPEN) return;
    if (client.socket.bufferedAmount > maxBufferedBytes) {
      client.socket.terminate();
      return;
    }
    client.socket.send(JSON.stringify(message));
  }

  private async receive(client: LiveClient, text: string): Promise<void> {
    let parsed;
    try {
      parsed = liveClientMessageSchema.safeParse(JSON.parse(text));
    } catch {
      parsed = null;
    }
    if (!parsed?.success) {
      this.send(client, { type: 'error', sweepId: null, code: 'bad_request', message: 'Send {"type": "subscribe" | "unsubscribe", "sweepId": "..."}.' });
      return;
    }
    const { sweepId } = parsed.data;
    if (parsed.data.type === 'unsubscribe') {
      client.sweeps.delete(sweepId);
      this.dropFeedIfUnwatched(sweepId);
      return;
    }
    await this.inOrder(sweepId, () => this.subscribe(client, sweepId));
  }

  /** Runs the step after the sweep's earlier subscriptions and events have been handled. */
  private async inOrder(sweepId: string, step: () => Promise<void>): Promise<void> {
    const previous = this.eventChains.get(sweepId) ?? Promise.resolve();
    const next = previous.then(step).catch((err: unknown) => this.logger.warn({ err, sweepId }, 'live view step failed'));
    this.eventChains.set(sweepId, next);
    await next;
    if (this.eventChains.get(sweepId) === next) this.eventChains.delete(sweepId);
  }

  private async subscribe(client: LiveClient, sweepId: string): Promise<void> {
    const em = this.orm.em.fork();
    const valid = /^[0-9a-f-]{36}$/i.test(sweepId);
    const sweep = valid ? await loadSweepForView(em, { id: sweepId, ...teamScope(client.user) }) : null;
    if (!sweep) {
      this.send(client, { type: 'error', sweepId, code: 'not_found', message: 'That sweep does not exist or is not yours to see.' });
      return;
    }
    const detail = await toSweepDetail(em, sweep);
    let feed = this.feeds.get(sweepId);
    if (!feed) {
      feed = new SweepFeed(sweepId, sweep.team.id);
      this.feeds.set(sweepId, feed);
    }
    feed.rebase(sweep);
    client.sweeps.add(sweepId);
    this.send(client, { type: 'state', sweep: detail, leaderboard: toSweepLeaderboard(sweep) });
  }

  private dropFeedIfUnwatched(sweepId: string): void {
    for (const client of this.clients) if (client.sweeps.has(sweepId)) return;
    this.feeds.delete(sweepId);
    clearTimeout(this.pendingProgress.get(sweepId));
    this.pendingProgress.delete(sweepId);
  }

  private broadcast(feed: SweepFeed, message: LiveServerMessage): void {
    for (const client of this.clients) {
      if (client.sweeps.has(feed.sweepId) && mayWatch(client.user, feed.teamId)) this.send(client, message);
    }
  }

  /** Sends the feed's progress now, or once the gap since the last one has passed (coalescing bursts). */
  private scheduleProgress(feed: SweepFeed): void {
    if (this.pendingProgress.has(feed.sweepId)) return;
    const wait = Math.max(0, feed.lastProgressAt + progressGapMs - Date.now());
    this.pendingProgress.set(
      feed.sweepId,
      setTimeout(() => {
        this.pendingProgress.delete(feed.sweepId);
        if (this.feeds.get(feed.sweepId) === feed) this.broadcast(feed, feed.progress());
      }, wait),
    );
  }

  private heartbeat(): void {
    const now = Date.now();
    for (const feed of this.feeds.values()) {
      if (feed.isRunning && now - feed.lastProgressAt >= progressHeartbeatMs - 150) this.scheduleProgress(feed);
    }
  }

  private ping(): void {
    for (const client of this.clients) {
      if (!client.alive) {
        client.socket.terminate();
        continue;
      }
      client.alive = false;
      client.socket.ping();
    }
  }

  private async listen(): Promise<void> {
    while (!this.closed) {
      const listener = new pg.Client({ connectionString: this.databaseUrl });
      this.listener = listener;
      const ended = new Promise<void>((resolve) => {
        listener.on('error', (err) => {
          if (!this.closed) this.logger.warn({ err }, 'live event connection failed; reconnecting');
          resolve();
        });
        listener.on('end', () => resolve());
      });
      try {
        await listener.connect();
        // close() may have come while connecting: it could not end a connection that did not exist yet.
        if (this.closed) break;
        listener.on('notification', (message) => void this.onEvent(message.payload));
        await listener.query(`LISTEN ${sweepEventChannel}`);
        await ended;
      } catch (err) {
        if (!this.closed) this.logger.warn({ err }, 'could not listen for sweep events; retrying');
      }
      await listener.end().catch(() => undefined);
      if (!this.closed) await new Promise((resolve) => setTimeout(resolve, 1000));
    }
    await this.listener?.end().catch(() => undefined);
  }

  private async onEvent(payload: string | undefined): Promise<void> {
    let event: SweepEvent;
    try {
      event = sweepEventSchema.parse(JSON.parse(payload ?? ''));
    } catch {
      this.logger.warn({ payload }, 'unreadable sweep event ignored');
      return;
    }
    if (event.kind === 'progress') {
      const feed = this.feeds.get(event.sweepId);
      if (!feed || feed.teamId !== event.teamId) return;
      if (feed.noteProgress(event.shardId, { evaluated: event.evaluated, rejected: event.rejected, seconds: event.elapsed })) this.scheduleProgress(feed);
      return;
    }
    // Watched, or a subscription is reading it right now (its feed comes when it has read the sweep).
    if (!this.feeds.has(event.sweepId) && !this.eventChains.has(event.sweepId)) return;
    await this.inOrder(event.sweepId, () => this.forward(event));
  }

  private async forward(event: Exclude<SweepEvent, { kind: 'progress' }>): Promise<void> {
    const feed = this.feeds.get(event.sweepId);
    if (!feed || feed.teamId !== event.teamId) return;
    try {
      const em = this.orm.em.fork();
      switch (event.kind) {
        case 'planned':
          for (const message of await feed.shardsPlanned(em)) this.broadcast(feed, message);
          return;
        case 'shard':
          for (const message of await feed.shardChanged(em, event.shardId)) this.broadcast(feed, message);
          this.scheduleProgress(feed);
          return;
        case 'leaderboard':
          for (const message of await feed.leaderboardChanged(em)) this.broadcast(feed, message);
          return;
        case 'state':
          for (const message of await feed.stateChanged(em)) this.broadcast(feed, message);
          return;
      }
    } catch (err) {
      this.logger.warn({ err, event }, 'sweep event could not be forwarded');
    }
  }
}
