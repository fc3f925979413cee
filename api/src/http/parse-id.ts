import * as z from 'zod';
import { notFound } from './http-error.js';

const uuid = z.uuid();

/** A malformed id cannot name anything that exists: answer as for a missing resource, not with a 500. */
export function parseId(raw: unknown, what: string): string {
  const result = uuid.safeParse(raw);
  if (!result.success) throw notFound(what);
  return result.data;
}
