import { expect } from 'chai';
import { apiErrorSchema } from '../../shared/schemas/api-error.js';
import { candidateSetListSchema, candidateSetSchema, generatedTermsSchema, termCheckSchema } from '../../shared/schemas/candidate-set.js';
import { AuditEvent } from '../../api/src/entities/audit-event.js';
import { CandidateSet } from '../../api/src/entities/candidate-set.js';
import { createTeamWithUsers, signIn, type TestAgent, type TeamWithUsers } from '../support/fixtures.js';
import { createProject } from '../support/sweep-scenario.js';
import { startTestApp, type TestApp } from '../support/test-app.js';

describe('candidate sets: terms checked on the server (/api/projects/:id/candidate-sets)', () => {
  let app: TestApp;
  let team: TeamWithUsers;
  let analyst: TestAgent;
  let projectId: string;
  const base = '/api/projects';

  before(async () => {
    app = await startTestApp();
    team = await createTeamWithUsers(app.orm, 'Terms lab');
    analyst = await signIn(app.baseUrl, team.analyst.email, team.password);
    projectId = await createProject(analyst, 'Cart rig');
  });
  after(() => app?.close());

  it('checks terms without saving: one verdict per term, refusals at their index, repeats marked', async () => {
    const response = await analyst.post(`${base}/${projectId}/candidate-sets/check`, {
      coordinates: ['x', 'th'],
      terms: ['dx^2', 'dth^2*cos(th)', 'sin(q)', 'exp(th)', '2*dth^2*cos(th)', 'sin(th)^2 + cos(th)^2'],
      known: [],
    });
    expect(response.status).to.equal(200);
    const check = termCheckSchema.parse(await response.json());
    expect(check.valid).to.equal(false);
    expect(check.problems.map((p) => p.path)).to.deep.equal(['terms.2', 'terms.3', 'terms.5']);
    expect(check.terms[2]!.error).to.contain('unknown symbol "q"');
    expect(check.terms[3]!.error).to.contain('function exp is not allowed');
    expect(check.terms[5]!.error).to.contain('constant');
    expect(check.terms[1]).to.include({ text: 'dth^2*cos(th)', velocityDegree: 2, error: null });
    expect(await app.orm.em.fork().count(CandidateSet, { project: projectId })).to.equal(0);

    const valid = termCheckSchema.parse(
      await (await analyst.post(`${base}/${projectId}/candidate-sets/check`, { coordinates: ['x', 'th'], terms: ['dx^2', 'cos(th)', '3*cos(th)', 'dx^2'], known: ['dx^2'] })).json(),
    );
    expect(valid.valid).to.equal(true);
    expect(valid.candidateCount).to.equal(1);
    expect(valid.terms.map((t) => t.excluded === null)).to.deep.equal([false, true, false, false]);
  });

  it('generates terms without saving, removals left out and additions appended', async () => {
    const response = await analyst.post(`${base}/${projectId}/candidate-sets/generate`, {
      coordinates: ['th'],
      generator: { remove: ['dth^2*sin(th)^2'], add: ['th^4'] },
    });
    const { terms } = generatedTermsSchema.parse(await response.json());
    // term-generator.ts: one angle with the defaults gives 8 terms (th, th^2, sin, cos, dth^2 times 1, sin, cos, sin^2).
    expect(terms).to.have.length(8);
    expect(terms.map((t) => t.text)).to.not.include('dth^2*sin(th)^2');
    expect(terms.at(-1)).to.deep.equal({ text: 'th^4', family: 'added' });
    const bad = await analyst.post(`${base}/${projectId}/candidate-sets/generate`, { coordinates: ['th'], generator: { angles: ['x'] } });
    expect(bad.status).to.equal(400);
    expect(apiErrorSchema.parse(await bad.json()).error.message).to.contain('"x", which is not a coordinate');
  });

  it('refuses to save a set with a bad term, with a field per term index, and saves nothing', async () => {
    const response = await analyst.post(`${base}/${projectId}/candidate-sets`, {
      name: 'Broken',
      coordinates: ['x', 'th'],
      terms: ['dx^2', 'cos(th', 'dth^2'],
      known: ['dx^2*y'],
      reference: { term: 'dth^2', coefficient: 0.5 },
    });
    expect(response.status).to.equal(400);
    const { error } = apiErrorSchema.parse(await response.json());
    expect(Object.keys(error.fields ?? {})).to.deep.equal(['terms.1', 'known.0']);
    expect(error.fields!['known.0']).to.contain('unknown symbol "y"');
    expect(await app.orm.em.fork().count(CandidateSet, { project: projectId })).to.equal(0);
  });

  it('saves, reads, replaces and deletes a set; names are unique within the project', async () => {
    const body = { name: 'Cart-pole basics', coordinates: ['x', 'th'], terms: ['dx^2', 'dx*dth*cos(th)', 'dth^2', 'cos(th)', 'cos(th)'], known: [] };
    const created = await analyst.post(`${base}/${projectId}/candidate-sets`, body);
    expect(created.status).to.equal(201);
    const set = candidateSetSchema.parse(await created.json());
    expect(set).to.include({ name: 'Cart-pole basics', candidateCount: 4 });
    expect(set.createdBy?.id).to.equal(team.analyst.id);
    const audit = await app.orm.em.fork().findOne(AuditEvent, { action: 'candidate_set.created', targetId: set.id });
    expect(audit?.actorId, 'the audit trail names the set and who created it').to.equal(team.analyst.id);
    expect((await analyst.post(`${base}/${projectId}/candidate-sets`, body)).status).to.equal(409);

    const replaced = await analyst.put(`/api/candidate-sets/${set.id}`, { ...body, terms: ['dx^2', 'dth^2', 'cos(th)'], reference: { term: 'dx^2', coefficient: 0.67 } });
    expect(replaced.status).to.equal(200);
    expect(candidateSetSchema.parse(await replaced.json())).to.deep.include({ candidateCount: 2, reference: { term: 'dx^2', coefficient: 0.67 } });
    const list = candidateSetListSchema.parse(await (await analyst.get(`${base}/${projectId}/candidate-sets`)).json());
    expect(list.candidateSets.map((s) => s.name)).to.deep.equal(['Cart-pole basics']);
    expect((await analyst.delete(`/api/candidate-sets/${set.id}`)).status).to.equal(204);
    expect((await analyst.get(`/api/candidate-sets/${set.id}`)).status).to.equal(404);
  });

  it('lets viewers check but not save, and answers 404 to other teams', async () => {
    const viewer = await signIn(app.baseUrl, team.viewer.email, team.password);
    const body = { name: 'Viewer set', coordinates: ['th'], terms: ['dth^2'] };
    expect((await viewer.post(`${base}/${projectId}/candidate-sets/check`, body)).status).to.equal(200);
    expect((await viewer.post(`${base}/${projectId}/candidate-sets`, body)).status).to.equal(403);
    const other = await createTeamWithUsers(app.orm, 'Foreign lab');
    const outsider = await signIn(app.baseUrl, other.analyst.email, other.password);
    expect((await outsider.post(`${base}/${projectId}/candidate-sets`, body)).status).to.equal(404);
    expect((await outsider.get(`${base}/${projectId}/candidate-sets`)).status).to.equal(404);
  });
});
