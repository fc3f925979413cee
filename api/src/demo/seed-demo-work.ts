import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import type { MikroORM } from '@mikro-orm/postgresql';
import type PgBoss from 'pg-boss';
import type { AllowanceLimits } from '../../../shared/schemas/allowance.js';
import { candidateSetInputSchema } from '../../../shared/schemas/candidate-set.js';
import { recordingMappingSchema } from '../../../shared/schemas/recording.js';
import { sweepLaunchSchema } from '../../../shared/schemas/sweep.js';
import { checkCandidateSet } from '../../../shared/sweeps/candidate-set-check.js';
import { generatedTermList } from '../../../shared/sweeps/generated-terms.js';
import { AuditEvent } from '../entities/audit-event.js';
import { CandidateSet } from '../entities/candidate-set.js';
import { Project } from '../entities/project.js';
import { Recording } from '../entities/recording.js';
import { User } from '../entities/user.js';
import { parseRecording } from '../recordings/recording-parse.js';
import { storeRecording } from '../recordings/recording-store.js';
import { recordAudit } from '../services/audit-trail.js';
import { launchSweep } from '../sweeps/sweep-launch.js';
import { demoProjectData, demoRecordingsDir, type DemoProjectData } from './demo-recordings.js';

interface SeededProject {
  data: DemoProjectData;
  project: Project;
  analyst: User;
  candidateSetId: string;
  recordingIds: { id: string; role: 'train' | 'validate' }[];
}

/**
 * Gives the demo projects their recordings (read through the same parser as uploads) and a generated
 * candidate set, once (`demo.work_seeded` in the audit trail marks it done), in one transaction.
 */
export async function seedDemoRecordings(orm: MikroORM): Promise<SeededProject[]> {
  return orm.em.fork().transactional(async (tx) => {
    if (await tx.count(AuditEvent, { action: 'demo.work_seeded' })) return [];
    const seeded: SeededProject[] = [];
    for (const data of demoProjectData) {
      const project = await tx.findOne(Project, { name: data.project, team: { name: data.team } }, { populate: ['team'] });
      const analyst = await tx.findOne(User, { team: { name: data.team }, role: 'analyst' }, { orderBy: { createdAt: 'asc' } });
      if (!project || !analyst || (await tx.count(Recording, { project }))) continue;
      const mapping = recordingMappingSchema.parse(data.mapping);
      const recordingIds: SeededProject['recordingIds'] = [];
      for (const file of data.recordings) {
        const text = readFileSync(new URL(file.file, demoRecordingsDir), 'utf8');
        const recording = storeRecording(tx, {
          project,
          name: file.name,
          fileName: file.file,
          sizeBytes: Buffer.byteLength(text),
          mapping,
          parsed: parseRecording(text, file.file, mapping),
          uploadedBy: { id: analyst.id, name: analyst.name },
        });
        recordingIds.push({ id: recording.id, role: file.role });
      }
      const generator = data.candidateSet.generator!;
      const terms = generatedTermList(data.candidateSet.coordinates, { add: [], remove: [], ...generator }).terms.map((t) => t.text);
      const input = candidateSetInputSchema.parse({ ...data.candidateSet, terms });
      const set = tx.create(CandidateSet, {
        id: randomUUID(),
        project,
        ...input,
        candidateCount: checkCandidateSet(input).candidateCount,
        createdById: analyst.id,
        createdByName: analyst.name,
      });
      seeded.push({ data, project, analyst, candidateSetId: set.id, recordingIds });
    }
    recordAudit(tx, null, { action: 'demo.work_seeded', details: { projects: seeded.map((s) => s.data.project) } });
    return seeded;
  });
}

/**
 * Seeds the demo recordings and candidate sets, then launches each demo project's first sweep as the team's
 * analyst, so the worker has a finished sweep to show shortly after the first start.
 */
export async function seedDemoWork(orm: MikroORM, boss: PgBoss, defaults: AllowanceLimits): Promise<number> {
  const seeded = await seedDemoRecordings(orm);
  for (const s of seeded) {
    const launch = sweepLaunchSchema.parse({
      name: s.data.sweep.name,
      candidateSetId: s.candidateSetId,
      trainingRecordingIds: s.recordingIds.filter((r) => r.role === 'train').map((r) => r.id),
      validationRecordingIds: s.recordingIds.filter((r) => r.role === 'validate').map((r) => r.id),
      settings: s.data.sweep.settings,
    });
    const project = await orm.em.fork().findOneOrFail(Project, { id: s.project.id }, { populate: ['team'] });
    await launchSweep(orm.em.fork(), boss, project, launch, { id: s.analyst.id, name: s.analyst.name, email: s.analyst.email }, defaults, null);
  }
  return seeded.length;
}
