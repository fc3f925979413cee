import { Injectable, type Signal, type WritableSignal, signal } from '@angular/core';
import { type Subscription, defer, repeat, retry, timer } from 'rxjs';
import { type WebSocketSubject, webSocket } from 'rxjs/webSocket';
import {
  type LiveClientMessage,
  type LiveProgress,
  type LiveServerMessage,
  liveServerMessageSchema,
} from '../../../../shared/schemas/live-message';
import type { SweepDetail, SweepSummary } from '../../../../shared/schemas/sweep';
import type { SweepLeaderboard } from '../../../../shared/schemas/sweep-leaderboard';

/** What the live connection knows of one sweep; null parts have not arrived yet. */
export interface LiveSweep {
  sweep: SweepDetail | null;
  leaderboard: SweepLeaderboard | null;
  progress: LiveProgress | null;
  /** A refusal of the subscription (another team's sweep, say), in words. */
  problem: string | null;
}

export type LiveConnection = 'idle' | 'connecting' | 'open' | 'reconnecting';

/** Longest wait between two attempts to reconnect. */
const maxBackoffMs = 15_000;

/**
 * The one WebSocket to the live hub (`/ws`), shared by every screen. Screens `watch` the sweeps they show;
 * the socket opens with the first watcher and closes after the last. When it drops it reconnects by itself
 * with growing pauses, subscribes again to every watched sweep, and the hub's first answer (`state`) brings
 * each view up to date. State lives in signals, so socket callbacks re-render zoneless views.
 */
@Injectable({ providedIn: 'root' })
export class LiveSweeps {
  private readonly watchers = new Map<string, number>();
  private readonly sweeps = new Map<string, WritableSignal<LiveSweep>>();
  private readonly status = signal<LiveConnection>('idle');
  private socket: WebSocketSubject<unknown> | null = null;
  private connection: Subscription | null = null;

  /** Whether the live view is connected; `reconnecting` after a drop until the socket is open again. */
  readonly connectionState = this.status.asReadonly();

  /** Starts following a sweep; call the returned function to stop. */
  watch(sweepId: string): { live: Signal<LiveSweep>; stop: () => void } {
    const live = this.entry(sweepId);
    const count = this.watchers.get(sweepId) ?? 0;
    this.watchers.set(sweepId, count + 1);
    if (count === 0) this.send({ type: 'subscribe', sweepId });
    this.connect();
    let stopped = false;
    const stop = () => {
      if (stopped) return;
      stopped = true;
      this.unwatch(sweepId);
    };
    return { live: live.asReadonly(), stop };
  }

  private unwatch(sweepId: string): void {
    const count = (this.watchers.get(sweepId) ?? 1) - 1;
    if (count > 0) {
      this.watchers.set(sweepId, count);
      return;
    }
    this.watchers.delete(sweepId);
    this.sweeps.delete(sweepId);
    this.send({ type: 'unsubscribe', sweepId });
    if (this.watchers.size === 0) this.disconnect();
  }

  private entry(sweepId: string): WritableSignal<LiveSweep> {
    let live = this.sweeps.get(sweepId);
    if (!live) {
      live = signal<LiveSweep>({ sweep: null, leaderboard: null, progress: null, problem: null });
      this.sweeps.set(sweepId, live);
    }
    return live;
  }

  private connect(): void {
    if (this.connection) return;
    this.status.set('connecting');
    this.connection = defer(() => this.openSocket())
      .pipe(
        // An error (refused upgrade, network) and a clean close both lead to a new attempt while anyone watches.
        retry({ delay: (_error, attempt) => this.pause(attempt), resetOnSuccess: true }),
        repeat({ delay: () => this.pause(1) }),
      )
      .subscribe((message) => this.receive(message));
  }

  private openSocket(): WebSocketSubject<unknown> {
    const scheme = location.protocol === 'https:' ? 'wss' : 'ws';
    const socket = webSocket<unknown>({
      url: `${scheme}://${location.host}/ws`,
      openObserver: {
        next: () => {
          this.status.set('open');
          for (const sweepId of this.watchers.keys()) socket.next({ type: 'subscribe', sweepId } satisfies LiveClientMessage);
        },
      },
    });
    this.socket = socket;
    return socket;
  }

  private pause(attempt: number) {
    this.socket = null;
    this.status.set('reconnecting');
    return timer(Math.min(maxBackoffMs, 500 * 2 ** Math.max(0, attempt - 1)));
  }

  private disconnect(): void {
    this.connection?.unsubscribe();
    this.connection = null;
    this.socket = null;
    this.status.set('idle');
  }

  /** Sends now when the socket is open; otherwise the subscribe on open covers it. */
  private send(message: LiveClientMessage): void {
    if (this.status() === 'open') this.socket?.next(message);
  }

  private receive(raw: unknown): void {
    const parsed = liveServerMessageSchema.safeParse(raw);
    if (!parsed.success) return;
    const message = parsed.data;
    const sweepId = message.type === 'state' ? message.sweep.id : message.sweepId;
    if (sweepId === null) return;
    const live = this.sweeps.get(sweepId);
    if (live) live.update((current) => applyMessage(current, message));
  }
}

/** The live state of a sweep after one message of the hub. */
export function applyMessage(current: LiveSweep, message: LiveServerMessage): LiveSweep {
  switch (message.type) {
    case 'state':
      // After a reconnect the last progress stays on screen until the next one arrives.
      return { sweep: message.sweep, leaderboard: message.leaderboard, progress: current.progress, problem: null };
    case 'progress':
      // The counters the sweep's summary shows move with the progress; its state moves with `sweep` and `ended`.
      return {
        ...current,
        progress: message,
        sweep: current.sweep
          ? { ...current.sweep, shardsDone: message.shardsDone, shardCount: message.shardCount, cpuSeconds: message.cpuSeconds }
          : null,
      };
    case 'shards': {
      if (!current.sweep) return current;
      const changed = new Map(message.shards.map((shard) => [shard.id, shard]));
      const shards = current.sweep.shards.map((shard) => changed.get(shard.id) ?? shard);
      for (const shard of message.shards) if (!current.sweep.shards.some((s) => s.id === shard.id)) shards.push(shard);
      shards.sort((a, b) => a.index - b.index);
      return { ...current, sweep: { ...current.sweep, shards } };
    }
    case 'leaderboard':
      return { ...current, leaderboard: message.leaderboard };
    case 'sweep':
    case 'ended':
      return { ...current, sweep: current.sweep ? withSummary(current.sweep, message.sweep) : null };
    case 'error':
      return { ...current, problem: message.message };
  }
}

function withSummary(detail: SweepDetail, summary: SweepSummary): SweepDetail {
  return { ...detail, ...summary };
}
