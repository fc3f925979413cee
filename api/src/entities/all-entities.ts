import { AuditEvent } from './audit-event.js';
import { CandidateSet } from './candidate-set.js';
import { MailMessage } from './mail-message.js';
import { Project } from './project.js';
import { Recording } from './recording.js';
import { RecordingSamples } from './recording-samples.js';
import { Shard } from './shard.js';
import { SubsetThroughput } from './subset-throughput.js';
import { Sweep } from './sweep.js';
import { SweepModel } from './sweep-model.js';
import { SweepTiming } from './sweep-timing.js';
import { Team } from './team.js';
import { TeamAllowance } from './team-allowance.js';
import { UsageCharge } from './usage-charge.js';
import { User } from './user.js';
import { WorkerPresence } from './worker-presence.js';

/** Every entity the ORM maps; listed explicitly (no globs) so tsx and compiled code behave the same. */
export const allEntities = [
  Team,
  User,
  Project,
  AuditEvent,
  Recording,
  RecordingSamples,
  CandidateSet,
  Sweep,
  SweepModel,
  Shard,
  TeamAllowance,
  UsageCharge,
  SubsetThroughput,
  SweepTiming,
  WorkerPresence,
  MailMessage,
];
