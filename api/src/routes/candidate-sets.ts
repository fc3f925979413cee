import { randomUUID } from 'node:crypto';
import type { MikroORM } from '@mikro-orm/postgresql';
import { Router, type Request } from 'express';
import { DiscoveryInputError } from '../../../shared/math/discovery-input-error.js';
import {
  candidateSetCheckInputSchema,
  candidateSetInputSchema,
  termGenerateInputSchema,
  type CandidateSetInput,
  type CandidateSetList,
  type TermCheck,
} from '../../../shared/schemas/candidate-set.js';
import { checkCandidateSet } from '../../../shared/sweeps/candidate-set-check.js';
import { generatedTermList } from '../../../shared/sweeps/generated-terms.js';
import { loadVisibleProject } from '../auth/project-access.js';
import { editorRoles, requireRole, requireUser } from '../auth/require-role.js';
import { teamScope } from '../auth/team-scope.js';
import { CandidateSet } from '../entities/candidate-set.js';
import { HttpError, notFound } from '../http/http-error.js';
import { parseBody } from '../http/parse-body.js';
import { parseId } from '../http/parse-id.js';
import { withUniqueConflict } from '../http/unique-conflict.js';
import { recordAudit } from '../services/audit-trail.js';
import { toCandidateSetView } from '../services/candidate-set-view.js';

const duplicateName = 'This project already has a candidate set with that name.';

/** Checks a set to be saved; refuses it with one field per bad term (`terms.3`, `known.0`, `reference.term`). */
function checkedForSaving(input: CandidateSetInput): TermCheck {
  const check = checkCandidateSet(input);
  if (check.valid) return check;
  const fields = Object.fromEntries(check.problems.map((problem) => [problem.path, problem.message]));
  const first = check.problems[0]?.message ?? 'The candidate set is not valid.';
  const more = check.problems.length > 1 ? ` (and ${check.problems.length - 1} more problem(s))` : '';
  throw new HttpError(400, 'invalid_body', `${first}${more}`, fields);
}

/** /api/projects/:projectId/candidate-sets: list, create, and check or generate terms without saving. */
export function projectCandidateSetsRouter(orm: MikroORM): Router {
  const router = Router({ mergeParams: true });

  router.get('/', requireUser, async (req, res) => {
    const project = await loadVisibleProject(orm.em, req);
    const sets = await orm.em.find(CandidateSet, { project }, { orderBy: { name: 'asc' } });
    const body: CandidateSetList = { candidateSets: sets.map(toCandidateSetView) };
    res.json(body);
  });

  router.post('/check', requireUser, async (req, res) => {
    await loadVisibleProject(orm.em, req);
    res.json(checkCandidateSet(parseBody(candidateSetCheckInputSchema, req)));
  });

  router.post('/generate', requireUser, async (req, res) => {
    await loadVisibleProject(orm.em, req);
    const input = parseBody(termGenerateInputSchema, req);
    try {
      res.json(generatedTermList(input.coordinates, input.generator));
    } catch (error) {
      if (error instanceof DiscoveryInputError) throw new HttpError(400, 'invalid_body', error.message, { generator: error.message });
      throw error;
    }
  });

  router.post('/', requireRole(...editorRoles), async (req, res) => {
    const project = await loadVisibleProject(orm.em, req);
    const input = parseBody(candidateSetInputSchema, req);
    const check = checkedForSaving(input);
    const set = orm.em.create(CandidateSet, {
      id: randomUUID(),
      project,
      ...input,
      candidateCount: check.candidateCount,
      createdById: req.user!.id,
      createdByName: req.user!.name,
    });
    recordAudit(orm.em, req, { action: 'candidate_set.created', teamId: project.team.id, targetType: 'candidate_set', targetId: set.id, details: { name: set.name } });
    await withUniqueConflict(() => orm.em.flush(), 'name', duplicateName);
    res.status(201).json(toCandidateSetView(set));
  });

  return router;
}

/** /api/candidate-sets/:id: read, replace and delete one (sweeps keep the copy they froze at launch). */
export function candidateSetsRouter(orm: MikroORM): Router {
  const router = Router();

  async function loadVisibleSet(req: Request): Promise<CandidateSet> {
    const id = parseId(req.params.id, 'That candidate set');
    const set = await orm.em.findOne(CandidateSet, { id, project: teamScope(req.user!) }, { populate: ['project'] });
    if (!set) throw notFound('That candidate set');
    return set;
  }

  router.get('/:id', requireUser, async (req, res) => {
    res.json(toCandidateSetView(await loadVisibleSet(req)));
  });

  router.put('/:id', requireRole(...editorRoles), async (req, res) => {
    const set = await loadVisibleSet(req);
    const input = parseBody(candidateSetInputSchema, req);
    const check = checkedForSaving(input);
    orm.em.assign(set, { ...input, candidateCount: check.candidateCount });
    recordAudit(orm.em, req, { action: 'candidate_set.updated', teamId: set.project.team.id, targetType: 'candidate_set', targetId: set.id, details: { name: set.name } });
    await withUniqueConflict(() => orm.em.flush(), 'name', duplicateName);
    res.json(toCandidateSetView(set));
  });

  router.delete('/:id', requireRole(...editorRoles), async (req, res) => {
    const set = await loadVisibleSet(req);
    recordAudit(orm.em, req, { action: 'candidate_set.deleted', teamId: set.project.team.id, targetType: 'candidate_set', targetId: set.id, details: { name: set.name } });
    orm.em.remove(set);
    await orm.em.flush();
    res.status(204).end();
  });

  return router;
}
