import { expect } from 'chai';
import { readFile } from 'node:fs/promises';
import type { Browser, Page } from 'playwright-core';
import { createLogger } from '../../api/src/logger.js';
import { type Mailbox, startMailbox } from '../../api/src/mailbox/mailbox-server.js';
import { binomial } from '../../shared/math/combinations.js';
import { safetyCaution } from '../../shared/model/safety-caution.js';
import type { AllowanceLimits } from '../../shared/schemas/allowance.js';
import { demoProjectData, demoRecordingsDir } from '../../api/src/demo/demo-recordings.js';
import { type RecordingMappingInput, recordingMappingSchema } from '../../shared/schemas/recording.js';
import { sweepLaunchSchema } from '../../shared/schemas/sweep.js';
import { type TeamWithUsers, createTeamWithUsers, signIn } from '../support/fixtures.js';
import {
  launchSweep,
  readSweep,
  setUpCartPoleProject,
  uploadRecording,
} from '../support/sweep-scenario.js';
import { type TestApp, startTestApp } from '../support/test-app.js';
import { type TestWorker, eventually, startTestWorker } from '../support/worker-processes.js';
import { csrfTokenOf } from './support/csrf-token.js';
import { dropFile } from './support/drop-file.js';
import type { GuardedPage } from './support/guarded-page.js';
import { launchBrowser } from './support/launch-browser.js';
import { expectCleanPage } from './support/page-expectations.js';
import { fetchFromPage } from './support/page-fetch.js';
import { saveScreenshot, saveScreenshots } from './support/screenshot.js';
import { openSignedIn } from './support/sign-in-as.js';
import { unnamedControls } from './support/unnamed-controls.js';

/** Limits far above what these sweeps need, so only the allowance test meets a limit. */
const roomyAllowance: AllowanceLimits = { cpuSecondsPerMonth: 10_000_000, sweepsAtOnce: 50, subsetsPerSweep: 1e12 };

/** The demo's quay crane: its recordings (committed CSV files) and their column mapping. */
const crane = demoProjectData.find((d) => d.project === 'Quay crane trolley')!;
const craneCsv = (file: string) => readFile(new URL(file, demoRecordingsDir), 'utf8');

/** Chromium logs every refused request itself; these are the refusals the tests provoke on purpose. */
const refusedUpload = /status of 400 .*\/recordings/;

/** Opens a select from the keyboard, as its label names it, and picks an option. */
async function chooseOption(page: Page, scope: ReturnType<Page['locator']>, label: string, option: string): Promise<void> {
  await scope.getByLabel(label, { exact: true }).focus();
  await page.keyboard.press('Enter');
  await page.getByRole('option', { name: option, exact: true }).click();
}

/**
 * Saves the screen for people to review (at 1280 and, with `wide`, 1440 pixels) and checks that every
 * control on it has a name a screen reader can announce.
 */
async function review(page: Page, name: string, wide = false): Promise<void> {
  await (wide ? saveScreenshots : saveScreenshot)(page, name);
  expect(await unnamedControls(page), `controls without a name on ${name}`).to.deep.equal([]);
}

async function setInput(scope: ReturnType<Page['locator']>, label: string, value: string): Promise<void> {
  await scope.getByLabel(label, { exact: true }).fill(value);
}

/** The demo crane's mapping with its two coordinates named as given. */
function craneMappingNamed(first: string, second: string): RecordingMappingInput {
  const [trolley, load] = crane.mapping.coordinates;
  return { ...crane.mapping, coordinates: [{ ...trolley!, name: first }, { ...load!, name: second }] };
}

/** Renames the suggested coordinates to x and th, as the demo's terms name them. */
async function mapCrane(page: Page): Promise<void> {
  const first = page.getByRole('listitem', { name: 'Coordinate 1' });
  const second = page.getByRole('listitem', { name: 'Coordinate 2' });
  await setInput(first, 'Name', 'x');
  await setInput(second, 'Name', 'th');
}

describe('the whole job in the web app', function () {
  let app: TestApp;
  let worker: TestWorker;
  let mailbox: Mailbox;
  let browser: Browser;
  let lab: TeamWithUsers;
  const tabs: GuardedPage[] = [];

  async function open(email: string, password: string): Promise<GuardedPage> {
    const tab = await openSignedIn(browser, app.baseUrl, email, password);
    tabs.push(tab);
    return tab;
  }

  before(async function () {
    app = await startTestApp({ allowanceDefaults: roomyAllowance });
    lab = await createTeamWithUsers(app.orm, 'Quay crane lab');
    mailbox = await startMailbox(app.orm, { port: 0, logger: createLogger('silent', 'mailbox-test') });
    // Shards of 200,000 subsets: the walk's sweep (1,391,841 subsets) merges into its leaderboard seven times, so
    // its changes can be watched, and the longer sweeps leave few shards behind when cancelled. E-mails go to
    // the local mailbox.
    [worker, browser] = await Promise.all([
      startTestWorker({ threads: 1, shardSubsets: 200_000, smtpUrl: `smtp://127.0.0.1:${mailbox.port}` }),
      launchBrowser(),
    ]);
  });

  after(async function () {
    await browser?.close();
    await worker?.stop();
    await mailbox?.close();
    await app?.close();
  });

  afterEach(async function () {
    if (this.currentTest?.state === 'failed') {
      for (const [i, tab] of tabs.entries()) await saveScreenshot(tab.page, `failed-${this.currentTest.title.slice(0, 40).replace(/\W+/g, '-')}-${i}`).catch(() => undefined);
      for (const tab of tabs) console.log(tab.console.errors.join('\n'));
      console.log(worker.log.slice(-5).join('\n'));
    }
    while (tabs.length) await tabs.pop()!.close();
  });

  describe('an analyst', function () {
    let projectUrl = '';
    let sweepUrl = '';

    it('creates a project and uploads a demo recording by file picker and by drag and drop; a bad cell is shown at its row and column', async function () {
      const tab = await open(lab.analyst.email, lab.password);
      const { page } = tab;
      await page.getByRole('button', { name: 'New project' }).click();
      const dialog = page.getByRole('dialog');
      await dialog.getByLabel('Name', { exact: true }).fill('Quay crane trolley');
      await dialog.getByLabel('Description').fill('Trolley on a rail with a hanging spreader; encoders on travel and sway.');
      await dialog.getByRole('button', { name: 'Create project' }).click();
      await page.getByRole('heading', { name: 'Quay crane trolley', level: 1 }).waitFor();
      projectUrl = new URL(page.url()).pathname.replace(/\/recordings$/, '');
      await page.getByRole('heading', { name: 'No recordings yet' }).waitFor();
      await review(page, 'project-empty');

      await page.getByRole('link', { name: 'Add the first recording' }).click();
      await page.getByRole('heading', { name: 'Add a recording', level: 1 }).waitFor();
      await review(page, 'recording-upload');

      // A copy of a demo recording whose data row 5 holds text where the load angle belongs.
      const good = await craneCsv('quay-crane-shift-a.csv');
      const lines = good.split('\n');
      lines[5] = lines[5]!.replace(/^([^,]*,[^,]*,)[^,]*/, '$1n/a');
      await page.locator('input[type=file]').setInputFiles({ name: 'quay-crane-broken.csv', mimeType: 'text/csv', buffer: Buffer.from(lines.join('\n')) });
      await page.getByRole('heading', { name: 'Column mapping' }).waitFor();
      await page.getByRole('button', { name: 'Add coordinate' }).click();
      await mapCrane(page);
      await chooseOption(page, page.getByRole('listitem', { name: 'Coordinate 2' }), 'Position column', 'load_angle_rad (has text cells)');
      await setInput(page.getByRole('listitem', { name: 'Coordinate 2' }), 'Unit', 'rad');
      await page.getByRole('button', { name: 'Upload recording' }).click();

      const problem = page.locator('[data-test=upload-problem]');
      await problem.waitFor();
      const text = await problem.innerText();
      expect(text).to.contain('data row 5');
      expect(text).to.contain('load_angle_rad');
      const marked = page.locator('td.fault');
      expect(await marked.innerText()).to.equal('n/a');
      await review(page, 'recording-upload-refused');

      // The intact file is dragged onto the drop zone this time.
      await page.getByRole('button', { name: 'Choose another file' }).click();
      await dropFile(page, '[data-test=drop-zone]', 'quay-crane-shift-a.csv', good);
      await page.getByRole('heading', { name: 'Column mapping' }).waitFor();
      await mapCrane(page);
      // Two coordinates of one name: the shared schema's sentence appears under the second name, before any upload.
      const secondName = page.getByRole('listitem', { name: 'Coordinate 2' }).getByLabel('Name', { exact: true });
      await secondName.fill('x');
      await secondName.blur();
      const twice = recordingMappingSchema.safeParse(craneMappingNamed('x', 'x')).error!.issues.find((i) => i.path.join('.') === 'coordinates.1.name')!.message;
      await page.getByRole('listitem', { name: 'Coordinate 2' }).locator('mat-error').getByText(twice).waitFor();
      await secondName.fill('th');
      // The force column was recognised from its name and put on the trolley's coordinate.
      expect(await page.getByRole('listitem', { name: 'Coordinate 1' }).getByLabel('Force column', { exact: true }).innerText()).to.contain('drive_force_N');
      // Before the upload the mapped channels are already previewed, with the sampling of the time column.
      const rows = good.trim().split('\n').slice(1);
      await page.locator('app-mapping-preview app-line-chart canvas').nth(2).waitFor();
      expect(await page.locator('app-mapping-preview app-line-chart').count(), 'x, th and the force on x').to.equal(3);
      expect(await page.locator('[data-test=preview-stats]').innerText()).to.match(new RegExp(`Samples\\s+${rows.length.toLocaleString('en-GB')}\\b`));
      await review(page, 'recording-mapping', true);

      // On a slow line (about 40 kB/s up) the upload shows how far it has come.
      const network = await page.context().newCDPSession(page);
      await network.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 40_000 });
      await page.getByRole('button', { name: 'Upload recording' }).click();
      const progress = page.locator('[data-test=upload-progress]');
      await progress.getByText('Uploading quay-crane-shift-a.csv').waitFor();
      await review(page, 'recording-uploading');
      await network.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
      await network.detach();

      await page.getByRole('heading', { name: 'quay-crane-shift-a', level: 1 }).waitFor();
      // Figures read off the file itself: its data rows, and the rate from its first time step.
      const step = Number(rows[1]!.split(',')[0]) - Number(rows[0]!.split(',')[0]);
      const stats = await page.locator('[data-test=sampling-stats]').innerText();
      expect(stats).to.match(new RegExp(`Samples\\s+${rows.length.toLocaleString('en-GB')}\\b`));
      expect(stats).to.match(new RegExp(`Sample rate\\s+${Number((1 / step).toPrecision(4))} per s`));
      await page.locator('app-line-chart canvas').first().waitFor();
      expect(await page.locator('app-line-chart').count(), 'one plot per channel: x, th, force on x').to.equal(3);
      await review(page, 'recording', true);
      expectCleanPage(tab, [refusedUpload]);
    });

    it('builds a candidate set with typeset terms, a known term and live checks', async function () {
      // Two more demo recordings through the API: one more for training, one held out for validation.
      const agent = await signIn(app.baseUrl, lab.analyst.email, lab.password);
      const projectId = projectUrl.split('/').pop()!;
      await uploadRecording(agent, projectId, await craneCsv('quay-crane-shift-b.csv'), 'quay-crane-shift-b.csv', crane.mapping);
      await uploadRecording(agent, projectId, await craneCsv('quay-crane-check.csv'), 'quay-crane-check.csv', crane.mapping);

      const tab = await open(lab.analyst.email, lab.password);
      const { page } = tab;
      await page.goto(`${projectUrl}/candidate-sets`);
      await page.locator('app-project-candidate-sets').getByRole('link', { name: 'Build a candidate set' }).click();
      await page.getByRole('heading', { name: 'New candidate set', level: 1 }).waitFor();
      await page.getByLabel('Name', { exact: true }).fill('Trolley and sway, degree 4');
      await chooseOption(page, page.locator('app-generator-options'), 'Coordinate powers', 'up to degree 4');
      await chooseOption(page, page.locator('app-generator-options'), 'Coordinate factors', 'up to degree 1');
      await page.getByRole('button', { name: 'Generate terms' }).click();

      // Generator with th the only angle (its unit is rad), powers to degree 4, kinetic factors to degree 1:
      // 34 terms (count from shared/math/term-generator.ts, as the sweep scenario of the integration tests states).
      const rows = page.locator('[data-test=term-row]');
      await eventually('34 generated terms', async () => ((await rows.count()) === 34 ? true : undefined), 20_000);
      const count = page.locator('[data-test=candidate-count]');
      await eventually('the check of 34 candidates', async () => ((await count.innerText()) === '34' ? true : undefined), 20_000);
      const sizeOne = page.locator('[data-test=subsets-at-size]').first();
      expect(await sizeOne.innerText()).to.equal('34');
      expect(await page.locator('[data-test=subsets-at-size]').nth(2).innerText()).to.equal(binomial(34, 3).toLocaleString('en-GB'));
      await rows.first().locator('.katex').first().waitFor();

      // dx^2 becomes a known term: one candidate fewer, and every count per size follows.
      await page.getByRole('radiogroup', { name: 'Role of dx^2', exact: true }).getByRole('radio', { name: 'Known' }).click();
      await eventually('33 candidates', async () => ((await count.innerText()) === '33' ? true : undefined), 20_000);
      expect(await page.locator('[data-test=subsets-at-size]').nth(2).innerText()).to.equal(binomial(33, 3).toLocaleString('en-GB'));

      // dth^2 as the reference term: it leaves the candidates, and its fixed coefficient can be set.
      await page.getByRole('radiogroup', { name: 'Role of dth^2', exact: true }).getByRole('radio', { name: 'Reference' }).click();
      await eventually('32 candidates', async () => ((await count.innerText()) === '32' ? true : undefined), 20_000);
      await page.getByLabel('Fixed coefficient').waitFor();
      await page.getByRole('radiogroup', { name: 'Role of dth^2', exact: true }).getByRole('radio', { name: 'Candidate' }).click();
      await eventually('33 candidates again', async () => ((await count.innerText()) === '33' ? true : undefined), 20_000);

      // A term over a symbol that is no coordinate is refused next to the field, and nothing is added.
      await page.getByLabel('Add a term').fill('dz^2');
      await page.getByRole('button', { name: 'Add', exact: true }).click();
      const refusal = page.locator('app-candidate-set-editor mat-hint.hint-error');
      await refusal.waitFor();
      expect(await refusal.innerText()).to.contain('dz');
      expect(await rows.count()).to.equal(34);
      // A repeat of a generated term is accepted into the list but the check says the sweep leaves it out.
      await page.getByLabel('Add a term').fill('2*cos(th)');
      await page.getByRole('button', { name: 'Add', exact: true }).click();
      const repeat = rows.last();
      await repeat.locator('.verdict.excluded').waitFor({ timeout: 20_000 });
      await review(page, 'candidate-set-editor', true);
      await repeat.getByRole('button', { name: 'Remove 2*cos(th)' }).click();
      await eventually('34 terms again', async () => ((await rows.count()) === 34 ? true : undefined), 10_000);

      await page.locator('[data-test=save-set]').click();
      await page.getByRole('heading', { name: 'Trolley and sway, degree 4', level: 1 }).waitFor();
      // The heading shows the saved name at once; the address follows when the router has moved to the set.
      await page.waitForURL(/\/candidate-sets\/[0-9a-f-]{36}$/, { timeout: 10_000 });
      expectCleanPage(tab);
    });

    it('launches a sweep after seeing its estimate, and watches the leaderboard change live', async function () {
      const tab = await open(lab.analyst.email, lab.password);
      const { page } = tab;
      await page.goto(`${projectUrl}/sweeps`);
      await page.locator('[data-test=new-sweep]').click();
      await page.getByRole('heading', { name: 'Launch a sweep', level: 1 }).waitFor();
      // Oldest recording trains, the others validate by default; the second run trains too.
      await page.getByRole('radiogroup', { name: 'Use of quay-crane-shift-b', exact: true }).getByRole('radio', { name: 'Training' }).click();
      // A size beyond what the launch schema allows is named under its field.
      await setInput(page.locator('form'), 'Largest size', '13');
      await page.getByLabel('Largest size', { exact: true }).blur();
      const tooLarge = sweepLaunchSchema.shape.settings.shape.sizes.safeParse({ min: 1, max: 13 }).error!.issues[0]!.message;
      await page.locator('mat-form-field', { hasText: 'Largest size' }).locator('mat-error').getByText(tooLarge).waitFor();
      await setInput(page.locator('form'), 'Largest size', '6');
      await setInput(page.locator('form'), 'Polynomial order', '6');

      // 33 candidates, sizes 1 to 6: sum of C(33, k) subsets (Knuth, TAOCP 4A, 7.2.1.3).
      const expected = [1, 2, 3, 4, 5, 6].reduce((sum, k) => sum + binomial(33, k), 0);
      const subsets = page.locator('[data-test=estimate-subsets]');
      await eventually('the estimate', async () => ((await subsets.innerText().catch(() => '')) === expected.toLocaleString('en-GB') ? true : undefined), 20_000);
      expect(await page.locator('[data-test=estimate-share]').innerText()).to.match(/%$/);
      // The estimate says what its figures rest on: measured here, or a default until measured.
      const basis = await page.locator('[data-test=estimate-basis]').innerText();
      expect(basis).to.match(/Speed per size: (measured on this installation|default until measured)/);
      expect(basis).to.match(/Fixed costs: .* to prepare, .* to handle each of 7 shards on 1 thread, .* to finish; (measured on this installation over the last|default until measured)/);
      await review(page, 'launch', true);

      await page.locator('[data-test=launch]').click();
      await page.locator('[data-test=leaderboard]').waitFor();
      sweepUrl = new URL(page.url()).pathname;
      expect(sweepUrl).to.match(/\/sweeps\/[0-9a-f-]{36}$/);

      // Every leaderboard version the page shows while the sweep runs; more than one means it changed live.
      const versions = new Set<string>();
      let screenshotWhileRunning = false;
      await eventually(
        'the sweep to finish',
        async () => {
          const version = await page.locator('[data-test=leaderboard-version]').innerText().catch(() => '');
          const state = await page.locator('app-sweep-state').first().innerText().catch(() => '');
          if (state.includes('Running')) {
            if (version) versions.add(version);
            if (!screenshotWhileRunning && (await page.locator('[data-test=leaderboard-row]').count()) > 0) {
              screenshotWhileRunning = true;
              await review(page, 'sweep-running', true);
            }
          }
          return state.includes('Finished') ? true : undefined;
        },
        180_000,
        150,
      );
      expect(versions.size, `leaderboard versions seen while running: ${[...versions].join(' | ')}`).to.be.greaterThan(1);
      await page.locator('[data-test=models]').waitFor({ timeout: 60_000 });
      expect(await page.locator('[data-test=progress-percent]').innerText()).to.equal('100 %');
      // The noise measured in the training signals, one row per coordinate of the demo trolley (x and th).
      const noiseRows = await page.locator('[data-test=signal-noise] tbody tr').allInnerTexts();
      expect(noiseRows.map((row) => row.split(/\s+/)[0])).to.deep.equal(['x', 'th']);
      for (const row of noiseRows) expect(row).to.match(/%/);
      expect(await page.locator('[data-test=coefficient-noise]').innerText()).to.match(/moves the best model's coefficients by up to .*%/);
      await review(page, 'sweep-finished', true);

      // Sorting the leaderboard by size puts the smallest models first.
      await page.getByRole('button', { name: 'Size', exact: true }).first().click();
      const sizes = await page.locator('[data-test=leaderboard-row] td:nth-child(2)').allInnerTexts();
      expect(sizes.map(Number)).to.deep.equal([...sizes.map(Number)].sort((a, b) => a - b));
      expectCleanPage(tab);
    });

    it('opens the best model and downloads an export carrying the caution', async function () {
      const tab = await open(lab.analyst.email, lab.password);
      const { page } = tab;
      // The way a newcomer goes: from the projects, into the project, and on from its latest sweep.
      await page.getByRole('link', { name: /Quay crane trolley/ }).click();
      await page.locator('[data-test=latest-sweep]').getByRole('link', { name: 'Open the best model' }).click();
      await page.getByRole('heading', { name: 'Best model', level: 1 }).waitFor();
      expect(new URL(page.url()).pathname).to.equal(`${sweepUrl}/models/0`);
      expect(await page.locator('[data-test=caution]').innerText()).to.contain(safetyCaution);
      await page.locator('[data-test=energy] .katex').waitFor({ timeout: 30_000 });
      await page.locator('[data-test=coefficients]').waitFor();
      await page.locator('app-recording-check-view app-line-chart canvas').first().waitFor();
      // The fit residual of the energy balance: its figures per recording of the sweep and its chart.
      const residual = page.locator('[data-test=fit-residual]');
      await residual.locator('app-line-chart canvas').waitFor();
      expect(await residual.getByRole('img', { name: 'Fit residual of the energy balance over time' }).count()).to.equal(1);
      const residualRows = await residual.locator('[data-test=fit-residual-figures] tbody tr').allInnerTexts();
      expect(residualRows.map((row) => row.split('\t')[0]!.trim())).to.deep.equal([
        'quay-crane-shift-a (training)',
        'quay-crane-shift-b (training)',
        'quay-crane-check (validation)',
      ]);
      await review(page, 'model', true);

      const download = page.waitForEvent('download');
      await page.locator('[data-test=export-python]').click();
      const file = await download;
      expect(file.suggestedFilename()).to.match(/\.py$/);
      const text = await readFile((await file.path())!, 'utf8');
      expect(text.replace(/\s*#\s*/g, ' ')).to.contain(safetyCaution);
      expectCleanPage(tab);
    });
  });

  describe('a running sweep', function () {
    it('recovers by itself after the live connection drops, and cancels after a confirmation', async function () {
      const agent = await signIn(app.baseUrl, lab.analyst.email, lab.password);
      const project = await setUpCartPoleProject(agent, 'Gantry pendulum');
      const sweep = await launchSweep(agent, project.projectId, project.launch(5, 'Long sweep'));

      const tab = await openSignedIn(browser, app.baseUrl, lab.analyst.email, lab.password);
      tabs.push(tab);
      const { page } = tab;
      // The live socket goes through a relay the test can cut, as a dropped network would.
      const relays: { close(): Promise<void> }[] = [];
      const subscribes: string[] = [];
      await page.routeWebSocket(/\/ws$/, (socket) => {
        const server = socket.connectToServer();
        socket.onMessage((message) => {
          subscribes.push(String(message));
          server.send(message);
        });
        relays.push({ close: () => socket.close({ code: 4000, reason: 'test drops the connection' }) });
      });
      await page.goto(`/projects/${project.projectId}/sweeps/${sweep.id}`);
      const status = page.locator('[data-test=live-status]');
      await eventually('the live view', async () => ((await status.innerText()).includes('Live') ? true : undefined), 30_000);
      await eventually('the sweep to run', async () => ((await page.locator('app-sweep-state').first().innerText()).includes('Running') ? true : undefined), 60_000);

      await relays[0]!.close();
      await eventually('a second connection', async () => (relays.length >= 2 ? true : undefined), 30_000);
      await eventually('the live view again', async () => ((await status.innerText()).includes('Live') ? true : undefined), 30_000);
      expect(subscribes.filter((m) => m.includes('subscribe') && m.includes(sweep.id)).length, 'subscribed again after the drop').to.be.at.least(2);
      const triedBefore = await page.locator('[data-test=progress-tried]').innerText();
      await eventually('progress after the reconnect', async () => ((await page.locator('[data-test=progress-tried]').innerText()) !== triedBefore ? true : undefined), 60_000);

      await page.locator('[data-test=cancel-sweep]').click();
      const confirm = page.getByRole('dialog');
      await confirm.getByRole('heading', { name: 'Cancel this sweep?' }).waitFor();
      await review(page, 'sweep-cancel-confirmation');
      await confirm.getByRole('button', { name: 'Cancel sweep' }).click();
      await eventually('the cancelled state', async () => ((await page.locator('app-sweep-state').first().innerText()).includes('Cancelled') ? true : undefined), 30_000);
      expect((await readSweep(agent, sweep.id)).state).to.equal('cancelled');
      expect(await page.locator('[data-test=cancel-sweep]').count()).to.equal(0);
      expectCleanPage(tab);
    });
  });

  describe('a viewer', function () {
    it('sees the team\'s work with no launch, edit or cancel control, and a forged launch or cancel is refused', async function () {
      const agent = await signIn(app.baseUrl, lab.analyst.email, lab.password);
      const project = await setUpCartPoleProject(agent, 'Balance beam rig');
      const running = await launchSweep(agent, project.projectId, project.launch(5, 'Sweep the viewer watches'));
      const base = `/projects/${project.projectId}`;

      const tab = await open(lab.viewer.email, lab.password);
      const { page } = tab;
      await page.goto(`${base}/recordings`);
      await page.getByRole('heading', { name: 'Balance beam rig', level: 1 }).waitFor();
      await page.locator('app-project-recordings table').waitFor();
      expect(await page.getByText('Read-only').count()).to.equal(1);
      expect(await page.getByRole('link', { name: /Add recording/ }).count()).to.equal(0);
      await review(page, 'viewer-recordings');

      await page.goto(`${base}/sweeps`);
      await page.locator('app-project-sweeps table').waitFor();
      expect(await page.locator('[data-test=new-sweep]').count(), 'launch control').to.equal(0);
      await page.goto(`${base}/candidate-sets/${project.candidateSet.id}`);
      await page.locator('[data-test=term-row]').first().waitFor();
      expect(await page.locator('[data-test=save-set]').count(), 'save control').to.equal(0);
      expect(await page.getByRole('button', { name: 'Generate terms' }).count()).to.equal(0);
      expect(await page.getByRole('radiogroup', { name: /^Role of / }).count(), 'role toggles').to.equal(0);
      expect(await page.getByRole('button', { name: /^Remove / }).count(), 'remove buttons').to.equal(0);
      expect(await page.getByLabel('Add a term').count(), 'term field').to.equal(0);
      await review(page, 'viewer-candidate-set');

      await page.goto(`${base}/sweeps/${running.id}`);
      await page.locator('[data-test=leaderboard]').waitFor();
      expect(await page.locator('[data-test=cancel-sweep]').count(), 'cancel control').to.equal(0);
      await review(page, 'viewer-sweep');

      // The launch and upload pages themselves are out of reach: the viewer lands on the project instead.
      for (const screen of ['sweeps/new', 'recordings/new', 'candidate-sets/new']) {
        await page.goto(`${base}/${screen}`);
        await page.getByRole('heading', { name: 'Balance beam rig', level: 1 }).waitFor();
        expect(new URL(page.url()).pathname, screen).to.equal(`${base}/recordings`);
      }
      // Administration is for admins: no link to it, and its address leads back to the projects.
      expect(await page.getByRole('link', { name: 'Administration' }).count()).to.equal(0);
      await page.goto('/admin/allowances');
      await page.getByRole('heading', { name: 'Projects', level: 1 }).waitFor();
      expect(await page.getByRole('button', { name: 'New project' }).count(), 'project creation').to.equal(0);

      // Forged from the page with the viewer's own session and anti-forgery token: the API says no.
      const token = await csrfTokenOf(page);
      const launch = await fetchFromPage(page, 'POST', `/api${base}/sweeps`, project.launch(2, 'Forged'), { 'X-XSRF-TOKEN': token });
      expect(launch.status).to.equal(403);
      expect(launch.body).to.have.nested.property('error.code', 'forbidden');
      const cancel = await fetchFromPage(page, 'POST', `/api/sweeps/${running.id}/cancel`, {}, { 'X-XSRF-TOKEN': token });
      expect(cancel.status).to.equal(403);
      expect((await readSweep(agent, running.id)).state).to.not.equal('cancelled');

      const cancelled = await agent.post(`/api/sweeps/${running.id}/cancel`, {});
      expect(cancelled.status).to.equal(200);
      expectCleanPage(tab, [/status of 403 /]);
    });
  });

  describe('an admin', function () {
    it('lowers a team\'s allowance, and the next launch is refused with the message shown', async function () {
      const quota = await createTeamWithUsers(app.orm, 'Harbour quota lab');
      const agent = await signIn(app.baseUrl, quota.analyst.email, quota.password);
      const project = await setUpCartPoleProject(agent, 'Spreader sway');
      // A first small sweep runs to its end: the team has used some CPU time, and its launcher got an e-mail.
      const first = await launchSweep(agent, project.projectId, project.launch(1, 'First look'));
      await eventually('the first sweep to finish', async () => ((await readSweep(agent, first.id)).state === 'finished' ? true : undefined), 120_000, 250);

      // The analyst prepares a launch while the allowance still allows it.
      const analystTab = await open(quota.analyst.email, quota.password);
      const analyst = analystTab.page;
      await analyst.goto(`/projects/${project.projectId}/sweeps/new`);
      await setInput(analyst.locator('form'), 'Largest size', '2');
      await analyst.locator('[data-test=estimate-subsets]').waitFor();
      expect(await analyst.locator('[data-test=estimate-refusal]').count()).to.equal(0);

      const adminTab = await open(quota.admin.email, quota.password);
      const admin = adminTab.page;
      await admin.getByRole('link', { name: 'Administration' }).click();
      await admin.getByRole('heading', { name: 'Administration', level: 1 }).waitFor();
      await admin.locator('app-users-panel table').waitFor();
      await review(admin, 'admin-users');
      await admin.getByRole('tab', { name: /Teams/ }).click();
      await admin.locator('app-teams-panel table').waitFor();
      await review(admin, 'admin-teams');
      await admin.getByRole('tab', { name: /Allowances/ }).click();
      const card = admin.getByRole('listitem', { name: `Allowance of ${quota.team.name}` });
      await card.getByRole('button', { name: 'Change limits' }).click();
      await card.getByLabel('CPU hours per month').fill('-1');
      await card.getByRole('button', { name: 'Save limits' }).click();
      await card.locator('mat-error').first().waitFor();
      await card.getByLabel('CPU hours per month').fill('0');
      await card.getByRole('button', { name: 'Save limits' }).click();
      await eventually('the saved limit', async () => ((await card.locator('[data-test=cpu-limit]').innerText()).startsWith('0') ? true : undefined), 20_000);
      await admin.locator('mat-snack-bar-container').getByRole('button', { name: 'Close' }).click();
      await review(admin, 'admin-allowances', true);
      await admin.getByRole('tab', { name: /Audit log/ }).click();
      await admin.locator('[data-test=audit-log]').getByText('Allowance changed').first().waitFor();
      await review(admin, 'admin-audit');
      // The end of the first sweep was announced by e-mail to its launcher, through the local mailbox.
      await admin.getByRole('tab', { name: /Mailbox/ }).click();
      const message = admin.locator('app-mailbox-panel .list button', { hasText: quota.analyst.email });
      await eventually('the e-mail in the mailbox', async () => {
        if ((await message.count()) > 0) return true;
        await admin.getByRole('button', { name: 'Refresh' }).click();
        return undefined;
      }, 30_000, 500);
      await message.first().click();
      await admin.locator('app-mailbox-panel .reader').getByText(/First look/).first().waitFor();
      await review(admin, 'admin-mailbox');

      const answer = analyst.waitForResponse((r) => r.request().method() === 'POST' && /\/sweeps$/.test(new URL(r.url()).pathname));
      await analyst.locator('[data-test=launch]').click();
      const refused = await answer;
      expect(refused.status()).to.equal(409);
      const body = (await refused.json()) as { error: { code: string; message: string } };
      expect(body.error.code).to.equal('allowance_exceeded');
      const shown = analyst.locator('[data-test=launch-refusal]');
      await shown.waitFor();
      expect(await shown.innerText()).to.contain(body.error.message);
      await review(analyst, 'launch-refused');
      expectCleanPage(analystTab, [/status of 409 /]);
      expectCleanPage(adminTab);
    });
  });
});
