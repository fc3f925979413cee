import { expect } from 'chai';
import type { LiveProgress, LiveServerMessage } from '../../shared/schemas/live-message.js';
import { createTeamWithUsers, signIn, type TeamWithUsers } from '../support/fixtures.js';
import { liveRefusal, openLiveClient, type LiveTestClient } from '../support/live-client.js';
import { launchSweep, setUpCartPoleProject } from '../support/sweep-scenario.js';
import { generousAllowance, startTestApp, type TestApp } from '../support/test-app.js';
import { startTestWorker, type TestWorker } from '../support/worker-processes.js';

type Of<T extends LiveServerMessage['type']> = Extract<LiveServerMessage, { type: T }>;
const is =
  <T extends LiveServerMessage['type']>(type: T) =>
  (message: LiveServerMessage): message is Of<T> =>
    message.type === type;

describe('live view: sweep progress over WebSockets (/ws)', () => {
  let app: TestApp;
  let worker: TestWorker | undefined;
  let mine: TeamWithUsers;
  let theirs: TeamWithUsers;
  const clients: LiveTestClient[] = [];

  before(async () => {
    app = await startTestApp({ allowanceDefaults: generousAllowance });
    mine = await createTeamWithUsers(app.orm, 'Live lab');
    theirs = await createTeamWithUsers(app.orm, 'Rival lab');
  });
  /** The worker starts only when a test has subscribed, so that test sees the sweep before it is prepared. */
  const startWorker = async () => {
    worker ??= await startTestWorker({ threads: 2, shardSubsets: 25_000_000 });
  };
  after(async () => {
    for (const client of clients) client.close();
    await worker?.stop();
    await app?.close();
  });

  it('refuses sockets without a session and from other origins', async () => {
    expect(await liveRefusal(app.baseUrl, { Origin: app.baseUrl })).to.equal(401);
    const agent = await signIn(app.baseUrl, mine.viewer.email, mine.password);
    expect(await liveRefusal(app.baseUrl, { Origin: 'http://elsewhere.example', Cookie: agent.cookieHeader() })).to.equal(403);
  });

  it('streams progress at least every second, shard states and leaderboard changes to its team only, late subscribers first get the state', async function () {
    this.timeout(240_000);
    const analyst = await signIn(app.baseUrl, mine.analyst.email, mine.password);
    const project = await setUpCartPoleProject(analyst, 'Live trolley');
    const viewer = await signIn(app.baseUrl, mine.viewer.email, mine.password);
    const outsider = await signIn(app.baseUrl, theirs.analyst.email, theirs.password);

    const watcher = await openLiveClient(app.baseUrl, viewer);
    const stranger = await openLiveClient(app.baseUrl, outsider);
    clients.push(watcher, stranger);
    const sweep = await launchSweep(analyst, project.projectId, project.launch(7, 'Watched live'));
    watcher.subscribe(sweep.id);
    stranger.subscribe(sweep.id);

    const first = await watcher.waitFor('the state snapshot', is('state'));
    expect(first.sweep.id).to.equal(sweep.id);
    expect(watcher.received[0]!.message.type).to.equal('state');
    expect(first.sweep).to.deep.include({ state: 'queued', shardCount: 0, shards: [] });
    const refusal = await stranger.waitFor('a refusal', is('error'));
    expect(refusal).to.include({ code: 'not_found', sweepId: sweep.id });

    // Once the prepare step has planned the shards, all of them arrive in one message, before the sweep runs.
    await startWorker();
    const running = await watcher.waitFor('the sweep running', (m) => m.type === 'sweep' && m.sweep.state === 'running');
    expect(running.type === 'sweep' && running.sweep.shardCount).to.be.above(1);
    const shardCount = running.type === 'sweep' ? running.sweep.shardCount : 0;
    const firstShards = watcher.received.find((r) => r.message.type === 'shards')!;
    const runningAt = watcher.received.find((r) => r.message === running)!;
    expect(watcher.received.indexOf(firstShards)).to.be.below(watcher.received.indexOf(runningAt));
    const planned = (firstShards.message as Of<'shards'>).shards;
    expect(planned.map((s) => s.index)).to.deep.equal([...Array(shardCount).keys()]);
    expect(planned.every((s) => s.state === 'queued' && s.subsets > 0)).to.equal(true);
    expect(planned.reduce((sum, s) => sum + s.subsets, 0)).to.equal(sweep.totalSubsets);

    // A late subscriber, once some shards have merged, first receives the sweep as stored now.
    await watcher.waitFor('a merged shard', (m) => m.type === 'leaderboard' && m.leaderboard.evaluated > 0, 120_000);
    const late = await openLiveClient(app.baseUrl, analyst);
    clients.push(late);
    late.subscribe(sweep.id);
    const lateState = await late.waitFor('the late state', is('state'));
    expect(late.received[0]!.message.type).to.equal('state');
    expect(lateState.sweep.state).to.equal('running');
    expect(lateState.leaderboard.evaluated).to.be.above(0);
    expect(lateState.leaderboard.overall.length).to.be.above(0);

    const ended = await watcher.waitFor('the end', is('ended'), 180_000);
    expect(ended.sweep.state).to.equal('finished');

    const messages = watcher.received;
    const startedAt = messages.find((r) => r.message.type === 'progress' && r.message.state === 'running')!.at;
    const endedAt = messages.find((r) => r.message.type === 'ended')!.at;
    const progress = messages.filter((r): r is { at: number; message: LiveProgress } => r.message.type === 'progress' && r.at >= startedAt && r.at <= endedAt);
    const gaps = progress.slice(1).map((r, i) => r.at - progress[i]!.at);
    const largestGap = Math.max(...gaps);
    console.log(`      progress messages: ${progress.length} over ${((endedAt - startedAt) / 1000).toFixed(1)} s, largest gap ${largestGap} ms, smallest ${Math.min(...gaps)} ms`);
    expect(progress.length).to.be.above(3);
    // At least one a second (the hub's promise), with 250 ms for timers on a loaded machine.
    expect(largestGap).to.be.at.most(1250);
    // Counts never go back, and end at the whole rank space.
    const covered = progress.map((r) => r.message.evaluated + r.message.rejected);
    expect(covered.every((value, i) => i === 0 || value >= covered[i - 1]!)).to.equal(true);
    expect(covered.some((value) => value > 0 && value < sweep.totalSubsets)).to.equal(true);
    expect(progress.some((r) => r.message.subsetsPerSecond !== null && r.message.subsetsPerSecond > 0)).to.equal(true);
    expect(progress.some((r) => r.message.etaSeconds !== null)).to.equal(true);
    const final = messages.filter((r) => r.message.type === 'progress').at(-1)!.message as LiveProgress;
    expect(final.evaluated + final.rejected).to.equal(ended.sweep.totalSubsets);
    // Shard and CPU counters travel with the progress: shards done climb to all of them, CPU seconds grow from
    // the running shards' time to the merged charges.
    expect(progress.every((r) => r.message.shardCount === ended.sweep.shardCount)).to.equal(true);
    const done = progress.map((r) => r.message.shardsDone);
    expect(done.every((value, i) => i === 0 || value >= done[i - 1]!)).to.equal(true);
    expect(final).to.include({ shardsDone: ended.sweep.shardCount, shardCount: ended.sweep.shardCount });
    expect(progress.some((r) => r.message.cpuSeconds > 0 && r.message.shardsDone < ended.sweep.shardCount)).to.equal(true);
    expect(final.cpuSeconds).to.be.closeTo(ended.sweep.cpuSeconds, 1e-9);

    // Shard states arrive as they change: each shard seen running and done.
    const shardMessages = messages.flatMap((r) => (r.message.type === 'shards' ? r.message.shards : []));
    const shardIds = new Set(shardMessages.map((s) => s.id));
    expect(shardIds.size).to.equal(ended.sweep.shardCount);
    expect(shardMessages.some((s) => s.state === 'running')).to.equal(true);
    expect([...shardIds].every((id) => shardMessages.some((s) => s.id === id && s.state === 'done'))).to.equal(true);

    // The leaderboard changed while the sweep ran: several versions, the best entry improving or holding.
    const boards = messages.filter((r) => r.at <= endedAt).flatMap((r) => (r.message.type === 'leaderboard' ? [r.message.leaderboard] : []));
    expect(new Set(boards.map((b) => b.version)).size).to.be.above(2);
    const bestRss = boards.filter((b) => b.overall.length > 0).map((b) => b.overall[0]!.rss);
    expect(bestRss.every((rss, i) => i === 0 || rss <= bestRss[i - 1]!)).to.equal(true);
    expect(new Set(boards.map((b) => JSON.stringify(b.overall))).size).to.be.above(1);
    expect(boards.at(-1)!.result, 'the finished result arrives live').to.not.equal(null);

    // The other team's client received the refusal and nothing else.
    expect(stranger.received.map((r) => r.message.type)).to.deep.equal(['error']);
  });

  it('lets an admin of another team watch any sweep', async () => {
    const analyst = await signIn(app.baseUrl, mine.analyst.email, mine.password);
    const project = await setUpCartPoleProject(analyst, 'Admin watched');
    await startWorker();
    const sweep = await launchSweep(analyst, project.projectId, project.launch(4, 'Small'));
    const admin = await openLiveClient(app.baseUrl, await signIn(app.baseUrl, theirs.admin.email, theirs.password));
    clients.push(admin);
    admin.subscribe(sweep.id);
    expect((await admin.waitFor('state', is('state'))).sweep.id).to.equal(sweep.id);
    await admin.waitFor('the end', is('ended'), 120_000);
  });

  it("closes a user's sockets when they sign out", async () => {
    const agent = await signIn(app.baseUrl, mine.viewer.email, mine.password);
    const client = await openLiveClient(app.baseUrl, agent);
    clients.push(client);
    expect((await agent.delete('/api/session')).status).to.equal(204);
    expect(await client.closed).to.equal(4001);
    expect(await liveRefusal(app.baseUrl, { Origin: app.baseUrl, Cookie: agent.cookieHeader() })).to.equal(401);
  });
});
