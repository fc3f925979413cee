import type { MikroORM } from '@mikro-orm/postgresql';
import { Router, type Request } from 'express';
import { modelExportFormatSchema, modelExportFormats, modelIndexSchema } from '../../../shared/schemas/model-request.js';
import { requireUser } from '../auth/require-role.js';
import { teamScope } from '../auth/team-scope.js';
import { Sweep } from '../entities/sweep.js';
import { HttpError, notFound } from '../http/http-error.js';
import { parseId } from '../http/parse-id.js';
import type { ModelDetailsPool } from '../models/model-details-pool.js';
import { modelExportFile } from '../models/model-export-file.js';
import { sweepModelDetails } from '../models/sweep-model-details.js';

/**
 * /api/sweeps/:sweepId/models/:modelIndex: one model of a finished sweep worked out (details, worked out once
 * and stored), and its downloads (/exports/:format). Everyone in the sweep's team may read them.
 */
export function sweepModelsRouter(orm: MikroORM, pool: ModelDetailsPool): Router {
  const router = Router();

  /** The visible sweep (with its result and project) and the model index; anything malformed names nothing: 404. */
  async function loadVisibleModel(req: Request) {
    const id = parseId(req.params.sweepId, 'That sweep');
    const index = modelIndexSchema.safeParse(req.params.modelIndex);
    if (!index.success) throw notFound('That model');
    const sweep = await orm.em.findOne(Sweep, { id, ...teamScope(req.user!) }, { populate: ['result', 'project'], refresh: true });
    if (!sweep) throw notFound('That sweep');
    return { sweep, project: sweep.project, modelIndex: index.data };
  }

  router.get('/:sweepId/models/:modelIndex', requireUser, async (req, res) => {
    const { sweep, project, modelIndex } = await loadVisibleModel(req);
    res.json(await sweepModelDetails(orm.em, pool, sweep, project, modelIndex));
  });

  router.get('/:sweepId/models/:modelIndex/exports/:format', requireUser, async (req, res) => {
    const format = modelExportFormatSchema.safeParse(req.params.format);
    if (!format.success) {
      const message = `There is no export format "${req.params.format}". The formats are: ${modelExportFormats.join(', ')}.`;
      throw new HttpError(400, 'bad_request', message, { format: `must be one of ${modelExportFormats.join(', ')}` });
    }
    const { sweep, project, modelIndex } = await loadVisibleModel(req);
    const details = await sweepModelDetails(orm.em, pool, sweep, project, modelIndex);
    const file = modelExportFile(details, format.data, { projectName: project.name, sweepId: sweep.id, modelIndex });
    // The name is made of [a-z0-9.-] only (modelExportFileName), so it needs no escaping inside the quotes.
    res.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
    res.type(file.contentType);
    res.send(file.text);
  });

  return router;
}
