import type { MikroORM } from '@mikro-orm/postgresql';
import { Router, type Request } from 'express';
import {
  recordingSamplesQuerySchema,
  recordingUploadFieldsSchema,
  type RecordingList,
  type RecordingSamples as RecordingSamplesAnswer,
} from '../../../shared/schemas/recording.js';
import { loadVisibleProject } from '../auth/project-access.js';
import { editorRoles, requireRole, requireUser } from '../auth/require-role.js';
import { teamScope } from '../auth/team-scope.js';
import { Recording } from '../entities/recording.js';
import { RecordingSamples } from '../entities/recording-samples.js';
import { singleFileUpload } from '../http/file-upload.js';
import { HttpError, notFound } from '../http/http-error.js';
import { parseInput } from '../http/parse-body.js';
import { parseId } from '../http/parse-id.js';
import { inspectCsv } from '../recordings/csv-inspection.js';
import { parseRecording } from '../recordings/recording-parse.js';
import { thinnedIndices } from '../../../shared/math/thinned-indices.js';
import { recordingUseCounts } from '../recordings/recording-usage.js';
import { toRecordingView } from '../recordings/recording-view.js';
import { storeRecording } from '../recordings/recording-store.js';
import { decodeChannels } from '../recordings/samples-codec.js';
import { uploadedText } from '../recordings/upload-error.js';
import { recordAudit } from '../services/audit-trail.js';

function uploadFields(req: Request) {
  const raw = (req.body ?? {}) as Record<string, unknown>;
  let mapping: unknown;
  try {
    mapping = typeof raw.mapping === 'string' ? JSON.parse(raw.mapping) : raw.mapping;
  } catch {
    throw new HttpError(400, 'invalid_body', 'The field "mapping" is not valid JSON.', { mapping: 'Not valid JSON.' });
  }
  const name = typeof raw.name === 'string' && raw.name.trim() !== '' ? raw.name : undefined;
  return parseInput(recordingUploadFieldsSchema, { name, mapping });
}

function baseName(fileName: string): string {
  return fileName.replace(/\.[^.]*$/, '').slice(0, 120) || 'recording';
}

/** /api/projects/:projectId/recordings: list, inspect (stores nothing) and upload. */
export function projectRecordingsRouter(orm: MikroORM, uploadLimitBytes: number): Router {
  const router = Router({ mergeParams: true });

  router.get('/', requireUser, async (req, res) => {
    const project = await loadVisibleProject(orm.em, req);
    const recordings = await orm.em.find(Recording, { project }, { orderBy: { createdAt: 'desc' } });
    const uses = await recordingUseCounts(orm.em, project.id);
    const body: RecordingList = { recordings: recordings.map((r) => toRecordingView(r, uses.get(r.id) ?? 0)) };
    res.json(body);
  });

  router.post('/inspect', requireRole(...editorRoles), singleFileUpload(uploadLimitBytes), async (req, res) => {
    await loadVisibleProject(orm.em, req);
    const file = req.file!;
    res.json(inspectCsv(uploadedText(file.buffer, file.originalname), file.originalname, file.size));
  });

  router.post('/', requireRole(...editorRoles), singleFileUpload(uploadLimitBytes), async (req, res) => {
    const project = await loadVisibleProject(orm.em, req);
    const file = req.file!;
    const fields = uploadFields(req);
    const parsed = parseRecording(uploadedText(file.buffer, file.originalname), file.originalname, fields.mapping);
    const user = req.user!;
    const recording = await orm.em.transactional(async (tx) => {
      const created = storeRecording(tx, {
        project,
        name: fields.name ?? baseName(file.originalname),
        fileName: file.originalname,
        sizeBytes: file.size,
        mapping: fields.mapping,
        parsed,
        uploadedBy: { id: user.id, name: user.name },
      });
      recordAudit(tx, req, {
        action: 'recording.uploaded',
        teamId: project.team.id,
        targetType: 'recording',
        targetId: created.id,
        details: { name: created.name, fileName: created.fileName, samples: created.sampleCount },
      });
      return created;
    });
    res.status(201).json(toRecordingView(recording, 0));
  });

  return router;
}

/** /api/recordings/:id: read one, its thinned samples for plots, delete when no sweep uses it. */
export function recordingsRouter(orm: MikroORM): Router {
  const router = Router();

  async function loadVisibleRecording(req: Request): Promise<Recording> {
    const id = parseId(req.params.id, 'That recording');
    const recording = await orm.em.findOne(Recording, { id, project: teamScope(req.user!) }, { populate: ['project'] });
    if (!recording) throw notFound('That recording');
    return recording;
  }

  router.get('/:id', requireUser, async (req, res) => {
    const recording = await loadVisibleRecording(req);
    const uses = await recordingUseCounts(orm.em, recording.project.id);
    res.json(toRecordingView(recording, uses.get(recording.id) ?? 0));
  });

  router.get('/:id/samples', requireUser, async (req, res) => {
    const recording = await loadVisibleRecording(req);
    const { points } = parseInput(recordingSamplesQuerySchema, req.query);
    const stored = await orm.em.findOneOrFail(RecordingSamples, { recording: recording.id });
    const channels = decodeChannels(stored.data, recording.channels.length, recording.sampleCount);
    const { stride, indices } = thinnedIndices(recording.sampleCount, points);
    const pick = (values: Float64Array) => indices.map((k) => values[k]!);
    const body: RecordingSamplesAnswer = {
      recordingId: recording.id,
      sampleCount: recording.sampleCount,
      stride,
      time: pick(channels[0]!),
      channels: recording.channels.slice(1).map((channel, c) => ({ ...channel, values: pick(channels[c + 1]!) })),
    };
    res.json(body);
  });

  router.delete('/:id', requireRole(...editorRoles), async (req, res) => {
    const recording = await loadVisibleRecording(req);
    const uses = (await recordingUseCounts(orm.em, recording.project.id)).get(recording.id) ?? 0;
    if (uses > 0) {
      throw new HttpError(409, 'conflict', `${uses} sweep(s) use this recording; it is kept as long as they exist.`);
    }
    recordAudit(orm.em, req, {
      action: 'recording.deleted',
      teamId: recording.project.team.id,
      targetType: 'recording',
      targetId: recording.id,
      details: { name: recording.name },
    });
    orm.em.remove(recording);
    await orm.em.flush();
    res.status(204).end();
  });

  return router;
}
