import { expect } from 'chai';
import type { Browser } from 'playwright-core';
import { Project } from '../../api/src/entities/project.js';
import { Team } from '../../api/src/entities/team.js';
import { signInSchema } from '../../shared/schemas/session.js';
import { createTeamWithUsers } from '../support/fixtures.js';
import { startTestApp } from '../support/test-app.js';
import { type GuardedPage, openGuardedPage } from './support/guarded-page.js';
import { readFontReport } from './support/font-report.js';
import { launchBrowser } from './support/launch-browser.js';
import { expectCleanPage } from './support/page-expectations.js';
import { saveScreenshot } from './support/screenshot.js';
import { signInThroughPage } from './support/sign-in-through-page.js';

type TestApp = Awaited<ReturnType<typeof startTestApp>>;
type People = Awaited<ReturnType<typeof createTeamWithUsers>>;

const benchRig = {
  name: 'Cart-pole bench rig',
  description: 'Cart on a linear rail with a free pendulum; rail position and pole angle from the encoders.',
};

/** The sentence the shared schema gives for a value, so the page is checked against the same source. */
function schemaMessage(field: 'email' | 'password', value: string): string {
  const result = signInSchema.shape[field].safeParse(value);
  if (result.success) throw new Error(`"${value}" is a valid ${field}`);
  return result.error.issues[0]!.message;
}

describe('signing in through the web app', function () {
  let app: TestApp;
  let browser: Browser;
  let lab: People;
  let quietTeam: People;
  let tab: GuardedPage;

  before(async function () {
    app = await startTestApp();
    lab = await createTeamWithUsers(app.orm, 'Motion lab');
    quietTeam = await createTeamWithUsers(app.orm, 'Quiet lab');
    const em = app.orm.em.fork();
    em.create(Project, { team: em.getReference(Team, lab.team.id), ...benchRig });
    await em.flush();
    browser = await launchBrowser();
  });

  after(async function () {
    await browser?.close();
    await app?.close();
  });

  beforeEach(async function () {
    tab = await openGuardedPage(browser, app.baseUrl);
  });

  afterEach(async function () {
    await tab?.close();
  });

  it('sends a visitor to the sign-in page, styled and with our own fonts under the server CSP', async function () {
    const { page } = tab;
    await page.goto('/projects');
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    expect(new URL(page.url()).pathname).to.equal('/sign-in');
    expect(await page.title()).to.equal('Sign in · Conserva');

    const fonts = await readFontReport(page);
    expect(fonts.bodyFont, 'global stylesheet applied').to.match(/^Roboto/);
    expect(fonts.loaded).to.include.members(['Roboto', 'Material Symbols Outlined']);

    await saveScreenshot(page, 'sign-in');
    expectCleanPage(tab);
  });

  it('names what is missing next to each field before asking the server', async function () {
    const { page } = tab;
    await page.goto('/sign-in');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();

    await page.getByText(schemaMessage('email', '')).waitFor();
    await page.getByText(schemaMessage('password', '')).waitFor();
    expect(tab.requests.urls.filter((url) => new URL(url).pathname === '/api/session')).to.have.length(1); // only the start-up GET
    await saveScreenshot(page, 'sign-in-missing-fields');
    expectCleanPage(tab);
  });

  it('says plainly when the e-mail and password do not match', async function () {
    const { page } = tab;
    await page.goto('/sign-in');
    await signInThroughPage(page, lab.analyst.email, `${lab.password}-not`);

    const alert = page.getByRole('alert');
    await alert.waitFor();
    expect(await alert.innerText()).to.contain('do not match an account');
    expect(new URL(page.url()).pathname).to.equal('/sign-in');
    await saveScreenshot(page, 'sign-in-wrong-password');
    // Chromium itself logs the refused POST; that one error is the point of this test.
    const refused = /status of 401 .*\/api\/session/;
    expect(tab.console.errors.filter((error) => refused.test(error))).to.have.length(1);
    expectCleanPage(tab, [refused]);
  });

  it('asks to wait after too many failed sign-ins', async function () {
    const { page } = tab;
    await page.goto('/sign-in');
    // The test app allows 5 failures per address and e-mail a minute (startTestApp default); the 6th is refused.
    // The admin is used only here, so the other tests' sign-ins are not throttled.
    const statuses: number[] = [];
    for (let attempt = 1; attempt <= 6; attempt++) {
      const answer = page.waitForResponse((r) => r.request().method() === 'POST' && new URL(r.url()).pathname === '/api/session');
      await signInThroughPage(page, lab.admin.email, `${lab.password}-guess-${attempt}`);
      statuses.push((await answer).status());
    }
    expect(statuses).to.deep.equal([401, 401, 401, 401, 401, 429]);

    const alert = page.getByRole('alert');
    await alert.filter({ hasText: 'Too many failed sign-in attempts' }).waitFor();
    expect(await alert.innerText()).to.match(/Wait \d+ minutes?, then try again/);
    await saveScreenshot(page, 'sign-in-too-many-attempts');
    expectCleanPage(tab, [/status of 401 .*\/api\/session/, /status of 429 .*\/api\/session/]);
  });

  it("signs the analyst in and lists their team's project", async function () {
    const { page } = tab;
    await page.goto('/');
    await signInThroughPage(page, lab.analyst.email, lab.password);

    await page.getByRole('heading', { name: 'Projects', level: 1 }).waitFor();
    expect(new URL(page.url()).pathname).to.equal('/projects');
    const card = page.getByRole('listitem').filter({ hasText: benchRig.name });
    await card.waitFor();
    expect(await card.innerText()).to.contain(benchRig.description);

    const who = await page.getByRole('group', { name: 'Signed in' }).innerText();
    expect(who).to.contain(lab.analyst.name);
    expect(who).to.contain(lab.team.name);
    expect(who).to.contain('Analyst');
    expect(tab.requests.urls.some((url) => new URL(url).pathname === '/api/projects')).to.equal(true);

    await saveScreenshot(page, 'projects');
    expectCleanPage(tab);
  });

  it('shows a team without projects an empty list that says so', async function () {
    const { page } = tab;
    await page.goto('/');
    await signInThroughPage(page, quietTeam.viewer.email, quietTeam.password);

    await page.getByRole('heading', { name: 'No projects yet' }).waitFor();
    expect(await page.getByText(benchRig.name).count(), "another team's project").to.equal(0);
    await saveScreenshot(page, 'projects-empty');
    expectCleanPage(tab);
  });

  it('can be used with the keyboard alone', async function () {
    const { page } = tab;
    await page.goto('/sign-in');
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    // The e-mail field has the focus on arrival; Enter in the password field sends the form.
    expect(await page.evaluate('document.activeElement?.getAttribute("autocomplete")')).to.equal('username');
    await page.keyboard.type(lab.analyst.email);
    await page.keyboard.press('Tab');
    await page.keyboard.type(lab.password);
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'Projects', level: 1 }).waitFor();

    const reached: string[] = [];
    for (let step = 0; step < 8 && reached.at(-1) !== 'Sign out'; step++) {
      await page.keyboard.press('Tab');
      reached.push((await page.locator(':focus').innerText()).replace(/\s+/g, ' ').replace(/^logout /, '').trim());
    }
    expect(reached, 'controls in tab order').to.include.members(['Skip to content', 'Sign out']);
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    expectCleanPage(tab);
  });

  it('signs out and ends the session on the server', async function () {
    const { page } = tab;
    await page.goto('/');
    await signInThroughPage(page, lab.analyst.email, lab.password);
    await page.getByRole('heading', { name: 'Projects', level: 1 }).waitFor();

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    const session = await page.evaluate(async () => (await fetch('/api/session')).json());
    expect(session).to.deep.equal({ user: null });

    await page.goto('/projects');
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    expectCleanPage(tab);
  });
});
