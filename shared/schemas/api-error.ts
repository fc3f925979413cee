import * as z from 'zod';

/** The one error shape every API route answers with: a stable code for programs and a sentence for people. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    /** Field-level problems, keyed by the path of the offending field (for forms). */
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;

/** Codes used across the API. Add here rather than inventing strings in routes. */
export const errorCodes = [
  'bad_request',
  'invalid_body',
  'unauthenticated',
  'bad_credentials',
  'forbidden',
  'not_found',
  'conflict',
  'csrf',
  'too_many_requests',
  'payload_too_large',
  'allowance_exceeded',
  'internal',
] as const;
export type ErrorCode = (typeof errorCodes)[number];
