import { randomUUID } from 'node:crypto';
import { defineEntity, type InferEntity } from '@mikro-orm/core';
import type { AuditAction } from '../../../shared/schemas/audit-event.js';

const p = defineEntity.properties;

/**
 * One security-relevant happening (sign-in, sign-out, admin change). Actor and target are plain ids and
 * copied e-mail rather than foreign keys, so the history outlives deleted users and teams.
 */
export const AuditEvent = defineEntity({
  name: 'AuditEvent',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    action: p.string().$type<AuditAction>().length(60).index(),
    actorId: p.uuid().nullable(),
    actorEmail: p.string().length(254).nullable(),
    teamId: p.uuid().nullable().index(),
    targetType: p.string().length(40).nullable(),
    targetId: p.uuid().nullable(),
    details: p.json<Record<string, unknown>>(),
    clientAddress: p.string().length(64).nullable(),
    createdAt: p.datetime().onCreate(() => new Date()).index(),
  },
});
export type AuditEvent = InferEntity<typeof AuditEvent>;
