import { expect } from 'chai';
import { createLogger } from '../../api/src/logger.js';
import { startMailbox, type Mailbox } from '../../api/src/mailbox/mailbox-server.js';
import { sweepOutcomeMail } from '../../api/src/mail/sweep-outcome-mail.js';
import { Sweep } from '../../api/src/entities/sweep.js';
import { mailboxListSchema, type MailboxMessage } from '../../shared/schemas/mailbox.js';
import { sweepLeaderboardSchema } from '../../shared/schemas/sweep-leaderboard.js';
import { createTeamWithUsers, signIn, type TeamWithUsers, type TestAgent } from '../support/fixtures.js';
import { launchSweep, readSweep, setUpCartPoleProject, type CartPoleProject } from '../support/sweep-scenario.js';
import { generousAllowance, startTestApp, type TestApp } from '../support/test-app.js';
import { eventually, startTestWorker, type TestWorker } from '../support/worker-processes.js';

describe("e-mail to the launcher when a sweep ends (local mailbox)", () => {
  let app: TestApp;
  let mailbox: Mailbox;
  let worker: TestWorker;
  let team: TeamWithUsers;
  let analyst: TestAgent;
  let admin: TestAgent;
  let project: CartPoleProject;

  async function inbox(address: string): Promise<MailboxMessage[]> {
    const response = await admin.get(`/api/admin/mailbox?to=${encodeURIComponent(address)}`);
    expect(response.status).to.equal(200);
    return mailboxListSchema.parse(await response.json()).messages;
  }

  async function notified(sweepId: string): Promise<void> {
    await eventually('the e-mail step', async () => ((await app.orm.em.fork().findOneOrFail(Sweep, { id: sweepId })).notifiedAt ? true : undefined), 60_000, 100);
  }

  before(async function () {
    this.timeout(120_000);
    app = await startTestApp({ allowanceDefaults: generousAllowance });
    mailbox = await startMailbox(app.orm, { port: 0, logger: createLogger('silent', 'mailbox-test') });
    worker = await startTestWorker({ threads: 2, shardSubsets: 20_000_000, smtpUrl: `smtp://127.0.0.1:${mailbox.port}` });
    team = await createTeamWithUsers(app.orm, 'Mail lab');
    analyst = await signIn(app.baseUrl, team.analyst.email, team.password);
    admin = await signIn(app.baseUrl, team.admin.email, team.password);
    project = await setUpCartPoleProject(analyst, 'Mailed trolley');
  });
  after(async () => {
    await worker?.stop();
    await mailbox?.close();
    await app?.close();
  });

  it('sends the outcome, the best energy, the counts and a link when the sweep finishes', async function () {
    this.timeout(120_000);
    const sweep = await launchSweep(analyst, project.projectId, project.launch(5, 'Trolley “north” run – 2'));
    await notified(sweep.id);
    const [message, ...more] = await inbox(team.analyst.email);
    expect(more).to.have.length(0);
    const finished = await readSweep(analyst, sweep.id);
    const board = sweepLeaderboardSchema.parse(await (await analyst.get(`/api/sweeps/${sweep.id}/leaderboard`)).json());
    expect(finished.state).to.equal('finished');
    expect(message!.subject).to.equal('Sweep "Trolley “north” run – 2" finished');
    expect(message!.to).to.deep.equal([team.analyst.email]);
    expect(message!.text).to.contain(`Best model: E = ${board.result!.best!.energy}`);
    expect(message!.text).to.contain(`Subsets evaluated: ${finished.evaluated.toLocaleString('en-US')} of ${finished.totalSubsets.toLocaleString('en-US')}`);
    expect(message!.text).to.contain(`http://conserva.test/projects/${project.projectId}/sweeps/${sweep.id}`);
    // What arrived is exactly what was composed (through nodemailer, smtp-server and the mailbox's reader).
    expect(message!.text).to.equal(sweepOutcomeMail(finished, team.analyst.email, 'http://conserva.test/').text);
  });

  it('tells the launcher who cancelled their sweep, and says nothing to someone who cancelled their own', async function () {
    this.timeout(120_000);
    const byAdmin = await launchSweep(analyst, project.projectId, project.launch(7, 'Stopped by the admin'));
    expect((await admin.post(`/api/sweeps/${byAdmin.id}/cancel`)).status).to.equal(200);
    await notified(byAdmin.id);
    const messages = await inbox(team.analyst.email);
    const cancelled = messages.find((m) => m.subject === 'Sweep "Stopped by the admin" was cancelled');
    expect(cancelled, messages.map((m) => m.subject).join(', ')).to.not.equal(undefined);
    expect(cancelled!.text).to.contain(`was cancelled by ${team.admin.name}`);

    const own = await launchSweep(analyst, project.projectId, project.launch(7, 'Stopped by its launcher'));
    expect((await analyst.post(`/api/sweeps/${own.id}/cancel`)).status).to.equal(200);
    await notified(own.id);
    expect((await inbox(team.analyst.email)).map((m) => m.subject)).to.not.include('Sweep "Stopped by its launcher" was cancelled');
  });

  it('shows the mailbox to admins only', async () => {
    expect((await analyst.get('/api/admin/mailbox')).status).to.equal(403);
  });
});
