import { expect } from 'chai';
import { readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { parseModelDocument } from '../../shared/model/model-document.js';
import { safetyCaution } from '../../shared/model/safety-caution.js';
import { apiErrorSchema } from '../../shared/schemas/api-error.js';
import { discoveryResultSchema } from '../../shared/schemas/discovery-result.js';
import { modelDetailsSchema, type ModelDetails } from '../../shared/schemas/model-details.js';
import { sweepDetailSchema } from '../../shared/schemas/sweep.js';
import { sweepLeaderboardSchema } from '../../shared/schemas/sweep-leaderboard.js';
import { SweepModel } from '../../api/src/entities/sweep-model.js';
import { createTeamWithUsers, signIn, type TestAgent } from '../support/fixtures.js';
import { cartPole } from '../support/mechanisms/handbook-mechanisms.js';
import { runModelSweep, type ModelSweep } from '../support/model-sweep.js';
import { runConserva } from '../support/run-cli.js';
import { generousAllowance, startTestApp, type TestApp } from '../support/test-app.js';
import { expectSameTerms } from '../unit/discovery/recovery-harness.js';

async function details(agent: TestAgent, sweepId: string, index: number | string): Promise<ModelDetails> {
  const response = await agent.get(`/api/sweeps/${sweepId}/models/${index}`);
  expect(response.status, await response.clone().text()).to.equal(200);
  return modelDetailsSchema.parse(await response.json());
}

describe('model details (GET /api/sweeps/:sweepId/models/:modelIndex)', () => {
  let app: TestApp;
  let run: ModelSweep;
  const storedRows = (sweepId: string, modelIndex?: number) =>
    app.orm.em.fork().count(SweepModel, { sweep: sweepId, ...(modelIndex === undefined ? {} : { modelIndex }) });

  before(async function () {
    this.timeout(240_000);
    app = await startTestApp({ allowanceDefaults: generousAllowance });
    run = await runModelSweep(app, 'Model details lab', 'Cart-pole details rig');
    expect(run.candidateSet.candidateCount).to.equal(34);
  });
  after(async () => {
    await app?.close();
    if (run) rmSync(run.folder, { recursive: true, force: true });
  });

  it('works out the best model once: the answer parses, one row is stored, and a second request answers that row', async () => {
    const { sweep, analyst } = run;
    expect(await storedRows(sweep.id)).to.equal(0);
    const first = await details(analyst, sweep.id, 0);
    expect(await storedRows(sweep.id, 0)).to.equal(1);
    const again = await details(analyst, sweep.id, 0);
    expect(await storedRows(sweep.id)).to.equal(1);
    // createdAt is the time of working out: equal answers mean the second came from the stored row.
    expect(first.document.createdAt).to.be.a('string');
    expect(again).to.deep.equal(first);
    const row = await app.orm.em.fork().findOneOrFail(SweepModel, { sweep: sweep.id, modelIndex: 0 });
    expect(modelDetailsSchema.parse(row.details)).to.deep.equal(first);
  });

  it('carries the caution, the sweep as provenance, the mass-matrix check of every recording and the simulation against the validation run', async () => {
    const { sweep, analyst } = run;
    const model = await details(analyst, sweep.id, 0);
    expect(model.caution).to.equal(safetyCaution);
    expect(model.document.caution).to.equal(safetyCaution);
    expect(model.document.provenance.source).to.equal('conserva sweep');
    expect(model.document.provenance.form).to.equal('balance');
    expect(model.document.provenance.estimator).to.deep.equal({ method: 'savitzky-golay', window: 9, order: 6 });
    expect(model.document.provenance.recordings).to.deep.equal(sweep.description.recordings.map((r) => ({ name: r.name, role: r.role })));
    expect(model.document.provenance.sweep).to.include({ id: sweep.id, name: sweep.name });
    expect(model.document.title).to.equal(`Cart-pole details rig, ${sweep.name}, model 1`);
    expect(model.massMatrixChecks.map((c) => c.recording)).to.deep.equal(sweep.description.recordings.map((r) => r.name));
    // The cart-pole's mass matrix [[M+m, m l cos th], [m l cos th, m l^2]] has determinant m l^2 (M + m sin^2 th) > 0
    // on every state (control textbooks' cart-pole equations): the discovered model must keep it positive definite.
    expect(model.massMatrixChecks.every((c) => c.notPositiveDefinite === 0 && c.checkedStates > 300)).to.equal(true);
    const validation = sweep.description.recordings.find((r) => r.role === 'validate')!;
    expect(model.validations.map((v) => [v.figures.recording, v.figures.role])).to.deep.equal([[validation.name, 'validate']]);
    expect(model.validations[0]!.trajectory.time.length).to.be.within(2, 600);
    expect(model.latex.equations).to.have.length(2);
  });

  it('carries the fit residual of the energy balance on every recording, in the sweep\'s form', async () => {
    const { sweep, analyst } = run;
    const residuals = (await details(analyst, sweep.id, 0)).fitResiduals!;
    expect(residuals.form).to.equal('balance');
    expect(residuals.recordings.map((r) => [r.recording, r.role])).to.deep.equal(sweep.description.recordings.map((r) => [r.name, r.role]));
    // The best model is the handbook cart-pole energy (see below), so dE/dt = P holds on the forced runs up to
    // the derivative estimates (energy balance, method.md section 2).
    for (const r of residuals.recordings) {
      expect(r.powerRms, r.recording).to.be.above(0);
      expect(r.rms, r.recording).to.be.below(1e-3 * r.powerRms);
      expect(r.time.length).to.equal(r.residual.length).and.to.be.within(2, 600);
    }
  });

  it('works a model stored before the fit residual existed out again once, keeping its time of writing', async () => {
    const { sweep, analyst } = run;
    const first = await details(analyst, sweep.id, 0);
    const { fitResiduals: _dropped, ...older } = first;
    await app.orm.em.fork().nativeUpdate(SweepModel, { sweep: sweep.id, modelIndex: 0 }, { details: older as ModelDetails });
    const renewed = await details(analyst, sweep.id, 0);
    expect(renewed.fitResiduals).to.deep.equal(first.fitResiduals);
    expect(renewed.document.createdAt).to.equal(first.document.createdAt);
    expect(await storedRows(sweep.id, 0)).to.equal(1);
    const row = await app.orm.em.fork().findOneOrFail(SweepModel, { sweep: sweep.id, modelIndex: 0 });
    expect(row.details.fitResiduals).to.deep.equal(first.fitResiduals);
  });

  it('stores a model once when first requests arrive together', async () => {
    const { sweep, analyst } = run;
    const viewer = await signIn(app.baseUrl, run.team.viewer.email, run.team.password);
    expect(await storedRows(sweep.id, 1)).to.equal(0);
    const answers = await Promise.all([details(analyst, sweep.id, 1), details(viewer, sweep.id, 1), details(analyst, sweep.id, 1)]);
    expect(await storedRows(sweep.id, 1)).to.equal(1);
    expect(answers[1]).to.deep.equal(answers[0]);
    expect(answers[2]).to.deep.equal(answers[0]);
  });

  it('gives the energy and equations of motion of the best model of the command line on the same data', async function () {
    this.timeout(120_000);
    const { sweep, analyst, folder } = run;
    const modelFile = path.join(folder, 'best-model.json');
    const cli = await runConserva(['discover', path.join(folder, 'description.json'), '--json', '--model-out', modelFile], { timeoutMs: 110_000 });
    expect(cli.status, cli.stderr).to.equal(0);
    const cliResult = discoveryResultSchema.parse(JSON.parse(cli.stdout));
    const cliModel = parseModelDocument(readFileSync(modelFile, 'utf8'), modelFile);
    const api = (await details(analyst, sweep.id, 0)).document;
    expect(api.energy).to.deep.equal(cliModel.energy);
    expect(api.lagrangian).to.deep.equal(cliModel.lagrangian);
    expect(api.equations).to.deep.equal(cliModel.equations);
    expect(api.provenance.scores).to.deep.equal(cliModel.provenance.scores);
    // Outside check: that model is the handbook cart-pole energy (control textbooks' cart-pole), to 1e-3.
    expectSameTerms(
      { terms: api.energy.terms.map((t) => t.term), coefficients: api.energy.terms.map((t) => t.coefficient) },
      cartPole.energyTerms,
      cartPole.coordinates,
      1e-3,
    );
    // Every other place of the result is the command line's model at that place.
    const board = sweepLeaderboardSchema.parse(await (await analyst.get(`/api/sweeps/${sweep.id}/leaderboard`)).json());
    expect(board.result!.models.map((m) => [m.terms, m.coefficients])).to.deep.equal(cliResult.models.map((m) => [m.terms, m.coefficients]));
    const last = board.result!.models.length - 1;
    const lastModel = await details(analyst, sweep.id, last);
    expect(lastModel.document.energy.terms).to.deep.equal(cliResult.models[last]!.terms.map((term, j) => ({ term, coefficient: cliResult.models[last]!.coefficients[j] })));
  });

  it('lets viewers of the team read, and answers 404 to another team and for places past the end', async () => {
    const { sweep, analyst } = run;
    const viewer = await signIn(app.baseUrl, run.team.viewer.email, run.team.password);
    expect(await details(viewer, sweep.id, 0)).to.deep.equal(await details(analyst, sweep.id, 0));
    const other = await createTeamWithUsers(app.orm, 'Model bystanders');
    const outsider = await signIn(app.baseUrl, other.analyst.email, other.password);
    const hidden = await outsider.get(`/api/sweeps/${sweep.id}/models/0`);
    expect(hidden.status).to.equal(404);
    expect(apiErrorSchema.parse(await hidden.json()).error.code).to.equal('not_found');
    const count = sweepLeaderboardSchema.parse(await (await analyst.get(`/api/sweeps/${sweep.id}/leaderboard`)).json()).result!.models.length;
    for (const place of [String(count), '-1', '01', 'best', '1.5']) {
      const response = await analyst.get(`/api/sweeps/${sweep.id}/models/${place}`);
      expect(response.status, place).to.equal(404);
    }
    expect((await analyst.get('/api/sweeps/not-a-sweep/models/0')).status).to.equal(404);
    const anonymous = await fetch(new URL(`/api/sweeps/${sweep.id}/models/0`, app.baseUrl));
    expect(anonymous.status).to.equal(401);
  });

  it('answers 409 with the reason for a sweep that has not finished, and for one cancelled with a partial leaderboard', async () => {
    const { analyst, projectId } = run;
    // No worker runs now: the sweep stays queued until it is cancelled.
    const launched = await analyst.post(`/api/projects/${projectId}/sweeps`, { ...run.launchBody, name: 'Never run' });
    expect(launched.status, await launched.clone().text()).to.equal(201);
    const queued = sweepDetailSchema.parse(await launched.json());
    const early = await analyst.get(`/api/sweeps/${queued.id}/models/0`);
    expect(early.status).to.equal(409);
    const earlyError = apiErrorSchema.parse(await early.json()).error;
    expect(earlyError.code).to.equal('conflict');
    expect(earlyError.message).to.contain('has not started yet');
    expect((await analyst.post(`/api/sweeps/${queued.id}/cancel`)).status).to.equal(200);
    const cancelled = await analyst.get(`/api/sweeps/${queued.id}/models/0/exports/json`);
    expect(cancelled.status).to.equal(409);
    expect(apiErrorSchema.parse(await cancelled.json()).error.message).to.match(/cancelled before it finished.*partial.*never re-fitted/);
    expect(await storedRows(queued.id)).to.equal(0);
  });
});
