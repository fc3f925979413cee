import type { EntityManager } from '@mikro-orm/postgresql';
import type { Request } from 'express';
import type { AuditAction } from '../../../shared/schemas/audit-event.js';
import { AuditEvent } from '../entities/audit-event.js';

export interface AuditInput {
  action: AuditAction;
  teamId?: string | null;
  targetType?: string;
  targetId?: string;
  details?: Record<string, unknown>;
  /** For events without a signed-in user (a failed sign-in): who it was about. */
  actorEmail?: string;
}

/**
 * Adds an audit event to the unit of work; it is written with the change it records at the next flush, so
 * either both land or neither does.
 */
export function recordAudit(em: EntityManager, req: Request | null, input: AuditInput): AuditEvent {
  return em.create(AuditEvent, {
    action: input.action,
    actorId: req?.user?.id ?? null,
    actorEmail: req?.user?.email ?? input.actorEmail ?? null,
    teamId: input.teamId ?? null,
    targetType: input.targetType ?? null,
    targetId: input.targetId ?? null,
    details: input.details ?? {},
    clientAddress: req?.ip ?? null,
  });
}
