import { expect } from 'chai';
import { apiErrorSchema } from '../../shared/schemas/api-error.js';
import { recordingInspectionSchema, recordingListSchema, recordingSamplesSchema, recordingSchema } from '../../shared/schemas/recording.js';
import { Recording } from '../../api/src/entities/recording.js';
import { RecordingSamples } from '../../api/src/entities/recording-samples.js';
import { createTeamWithUsers, signIn, type TestAgent, type TeamWithUsers } from '../support/fixtures.js';
import { cartPoleCsv, cartPoleMapping, cartPoleTrainingRuns, createProject, csvForm } from '../support/sweep-scenario.js';
import { startTestApp, type TestApp } from '../support/test-app.js';

/** The CSV's cells as numbers, parsed by Number() independently of the server's reader. */
function columnOf(csv: string, column: string): number[] {
  const [header, ...rows] = csv.trim().split('\n');
  const index = header!.split(',').indexOf(column);
  return rows.map((row) => Number(row.split(',')[index]));
}

describe('recordings: upload, validation and storage (/api/projects/:id/recordings)', () => {
  let app: TestApp;
  let team: TeamWithUsers;
  let analyst: TestAgent;
  let projectId: string;
  const csv = cartPoleCsv(cartPoleTrainingRuns[0]!);

  async function storedCount(): Promise<{ recordings: number; samples: number }> {
    const em = app.orm.em.fork();
    return { recordings: await em.count(Recording, { project: projectId }), samples: await em.count(RecordingSamples, {}) };
  }

  async function expectRefusal(response: Response, status: number): Promise<{ message: string; fields: Record<string, string> }> {
    expect(response.status).to.equal(status);
    const { error } = apiErrorSchema.parse(await response.json());
    return { message: error.message, fields: error.fields ?? {} };
  }

  before(async () => {
    app = await startTestApp({ uploadLimitBytes: 64 * 1024 });
    team = await createTeamWithUsers(app.orm, 'Upload lab');
    analyst = await signIn(app.baseUrl, team.analyst.email, team.password);
    projectId = await createProject(analyst, 'Trolley rig');
  });
  after(() => app?.close());

  it('inspects a file without storing it: header, preview, numeric columns and the time column', async () => {
    const before = await storedCount();
    const response = await analyst.postForm(`/api/projects/${projectId}/recordings/inspect`, csvForm(csv, 'run-1.csv'));
    expect(response.status).to.equal(200);
    const inspection = recordingInspectionSchema.parse(await response.json());
    expect(inspection.header).to.deep.equal(['t_s', 'cart_x_m', 'pole_angle_rad', 'cart_force_N']);
    expect(inspection.rowCount).to.equal(401);
    expect(inspection.numericColumns).to.deep.equal(inspection.header);
    expect(inspection.suggestedTimeColumn).to.equal('t_s');
    expect(inspection.previewRows[0]![0]).to.equal('0');
    expect(await storedCount()).to.deep.equal(before);
  });

  it('stores a mapped recording: channels, units, sample count, duration, sampling and the exact samples', async () => {
    const response = await analyst.postForm(`/api/projects/${projectId}/recordings`, csvForm(csv, 'run-1.csv', cartPoleMapping, 'Forced run 1'));
    expect(response.status, await response.clone().text()).to.equal(201);
    const recording = recordingSchema.parse(await response.json());
    expect(recording).to.include({ name: 'Forced run 1', fileName: 'run-1.csv', sampleCount: 401, forced: true, sweepCount: 0 });
    expect(recording.coordinates).to.deep.equal(['x', 'th']);
    expect(recording.channels.map((c) => [c.key, c.kind, c.column, c.unit])).to.deep.equal([
      ['time', 'time', 't_s', 's'],
      ['x', 'position', 'cart_x_m', 'm'],
      ['force:x', 'force', 'cart_force_N', 'N'],
      ['th', 'position', 'pole_angle_rad', 'rad'],
    ]);
    // The simulation sampled every 0.01 s for 4 s (our choice of step), so 100 samples per second.
    expect(recording.durationSeconds).to.be.closeTo(4, 1e-12);
    expect(recording.sampling.sampleRate).to.be.closeTo(100, 1e-6);
    expect(recording.sampling.uniform).to.equal(true);

    const samples = recordingSamplesSchema.parse(await (await analyst.get(`/api/recordings/${recording.id}/samples?points=1000`)).json());
    expect(samples.stride).to.equal(1);
    expect(samples.time).to.deep.equal(columnOf(csv, 't_s'));
    expect(samples.channels.find((c) => c.key === 'th')!.values).to.deep.equal(columnOf(csv, 'pole_angle_rad'));
    expect(samples.channels.find((c) => c.key === 'force:x')!.values).to.deep.equal(columnOf(csv, 'cart_force_N'));

    const list = recordingListSchema.parse(await (await analyst.get(`/api/projects/${projectId}/recordings`)).json());
    expect(list.recordings.map((r) => r.id)).to.include(recording.id);
  });

  it('thins samples for plots to the points asked for, keeping the first and last sample', async () => {
    const { recordings } = recordingListSchema.parse(await (await analyst.get(`/api/projects/${projectId}/recordings`)).json());
    const samples = recordingSamplesSchema.parse(await (await analyst.get(`/api/recordings/${recordings[0]!.id}/samples?points=50`)).json());
    expect(samples.time.length).to.be.at.most(51);
    expect(samples.time[0]).to.equal(0);
    expect(samples.time.at(-1)).to.be.closeTo(4, 1e-12);
    expect(samples.stride).to.equal(9);
  });

  it('refuses a mapping that names a column the file lacks, naming the column, and stores nothing', async () => {
    const before = await storedCount();
    const mapping = { ...cartPoleMapping, time: { column: 'time', unit: 's' } };
    const { message, fields } = await expectRefusal(await analyst.postForm(`/api/projects/${projectId}/recordings`, csvForm(csv, 'run-1.csv', mapping)), 400);
    expect(message).to.contain('no column "time"');
    expect(fields.column).to.equal('time');
    expect(await storedCount()).to.deep.equal(before);
  });

  it('refuses a non-numeric cell with its line, data row and column, and stores nothing', async () => {
    const before = await storedCount();
    const lines = csv.split('\n');
    const cells = lines[17]!.split(',');
    cells[2] = '0.3x';
    lines[17] = cells.join(',');
    const { message, fields } = await expectRefusal(await analyst.postForm(`/api/projects/${projectId}/recordings`, csvForm(lines.join('\n'), 'bad.csv', cartPoleMapping)), 400);
    expect(message).to.contain('"0.3x" is not a number');
    expect(fields).to.include({ line: '18', row: '17', column: 'pole_angle_rad' });
    expect(await storedCount()).to.deep.equal(before);
  });

  it('refuses a row with a missing cell, naming its line, and stores nothing', async () => {
    const before = await storedCount();
    const lines = csv.split('\n');
    lines[5] = lines[5]!.split(',').slice(0, 3).join(',');
    const { message, fields } = await expectRefusal(await analyst.postForm(`/api/projects/${projectId}/recordings`, csvForm(lines.join('\n'), 'short.csv', cartPoleMapping)), 400);
    expect(message).to.contain('line 6: 3 cells');
    expect(fields.line).to.equal('6');
    expect(await storedCount()).to.deep.equal(before);
  });

  it('refuses a mapping that is not valid, per field', async () => {
    const mapping = { time: { column: 't_s' }, coordinates: [{ name: 'x', column: 't_s' }] };
    const { fields } = await expectRefusal(await analyst.postForm(`/api/projects/${projectId}/recordings`, csvForm(csv, 'run-1.csv', mapping)), 400);
    expect(fields['mapping.coordinates.0.column']).to.contain('already mapped as time');
    const clash = { time: { column: 't_s' }, coordinates: [{ name: 'x', column: 'cart_x_m' }, { name: 'dx', column: 'pole_angle_rad' }] };
    const second = await expectRefusal(await analyst.postForm(`/api/projects/${projectId}/recordings`, csvForm(csv, 'run-1.csv', clash)), 400);
    expect(second.fields['mapping.coordinates']).to.contain('clashes with the velocity');
  });

  it('refuses a file above the size limit with 413 and stores nothing', async () => {
    const before = await storedCount();
    const large = csv + csv.split('\n').slice(1).join('\n').repeat(3);
    expect(large.length).to.be.above(64 * 1024);
    const { message } = await expectRefusal(await analyst.postForm(`/api/projects/${projectId}/recordings`, csvForm(large, 'large.csv', cartPoleMapping)), 413);
    expect(message).to.contain('larger than the limit of 0.1 MB');
    expect(await storedCount()).to.deep.equal(before);
  });

  it('refuses a binary file', async () => {
    const { message } = await expectRefusal(await analyst.postForm(`/api/projects/${projectId}/recordings`, csvForm('\u0000\u0001\u0002', 'blob.csv', cartPoleMapping)), 400);
    expect(message).to.contain('not a text (UTF-8) CSV file');
  });

  it('lets viewers read but not upload, and hides recordings from other teams', async () => {
    const viewer = await signIn(app.baseUrl, team.viewer.email, team.password);
    expect((await viewer.postForm(`/api/projects/${projectId}/recordings`, csvForm(csv, 'v.csv', cartPoleMapping))).status).to.equal(403);
    const { recordings } = recordingListSchema.parse(await (await viewer.get(`/api/projects/${projectId}/recordings`)).json());
    expect(recordings).to.have.length(1);
    const other = await createTeamWithUsers(app.orm, 'Other lab');
    const outsider = await signIn(app.baseUrl, other.analyst.email, other.password);
    expect((await outsider.get(`/api/projects/${projectId}/recordings`)).status).to.equal(404);
    expect((await outsider.get(`/api/recordings/${recordings[0]!.id}`)).status).to.equal(404);
    expect((await outsider.get(`/api/recordings/${recordings[0]!.id}/samples`)).status).to.equal(404);
    expect((await outsider.delete(`/api/recordings/${recordings[0]!.id}`)).status).to.equal(404);
  });

  it('deletes a recording no sweep uses, with its samples', async () => {
    const recording = recordingSchema.parse(await (await analyst.postForm(`/api/projects/${projectId}/recordings`, csvForm(csv, 'spare.csv', cartPoleMapping))).json());
    const before = await storedCount();
    expect((await analyst.delete(`/api/recordings/${recording.id}`)).status).to.equal(204);
    expect(await storedCount()).to.deep.equal({ recordings: before.recordings - 1, samples: before.samples - 1 });
  });
});
