import * as z from 'zod';

/** A worker process as it last reported itself. GET /api/admin/workers -> workerListSchema. */
export const workerPresenceSchema = z.object({
  id: z.string(),
  host: z.string(),
  pid: z.number().int(),
  threads: z.number().int(),
  startedAt: z.string(),
  lastSeenAt: z.string(),
  /** Reported within the last 30 seconds. */
  alive: z.boolean(),
});
export type WorkerPresence = z.infer<typeof workerPresenceSchema>;

export const workerListSchema = z.object({ workers: z.array(workerPresenceSchema) });
export type WorkerList = z.infer<typeof workerListSchema>;
