import * as z from 'zod';

/** Actions recorded in the audit trail. */
export const auditActions = [
  'session.signed_in',
  'session.sign_in_failed',
  'session.signed_out',
  'team.created',
  'team.renamed',
  'team.deleted',
  'user.created',
  'user.updated',
  'user.deleted',
  'project.created',
  'project.updated',
  'project.deleted',
  'demo.seeded',
  'demo.work_seeded',
  'recording.uploaded',
  'recording.deleted',
  'candidate_set.created',
  'candidate_set.updated',
  'candidate_set.deleted',
  'sweep.launched',
  'sweep.cancelled',
  'allowance.updated',
] as const;
export const auditActionSchema = z.enum(auditActions);
export type AuditAction = z.infer<typeof auditActionSchema>;

/** One audit event as admins see it. */
export const auditEventSchema = z.object({
  id: z.string(),
  action: auditActionSchema,
  actorId: z.string().nullable(),
  actorEmail: z.string().nullable(),
  teamId: z.string().nullable(),
  targetType: z.string().nullable(),
  targetId: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
  createdAt: z.string(),
});
export type AuditEventView = z.infer<typeof auditEventSchema>;

/** Answer of GET /api/admin/audit-events. */
export const auditEventListSchema = z.object({ events: z.array(auditEventSchema) });
export type AuditEventList = z.infer<typeof auditEventListSchema>;
