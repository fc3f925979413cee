import { UniqueConstraintViolationException } from '@mikro-orm/core';
import { HttpError } from './http-error.js';

/** Runs a write and turns a unique-constraint violation into 409 with a message on the given field. */
export async function withUniqueConflict<T>(write: () => Promise<T>, field: string, message: string): Promise<T> {
  try {
    return await write();
  } catch (error) {
    if (error instanceof UniqueConstraintViolationException) throw new HttpError(409, 'conflict', message, { [field]: message });
    throw error;
  }
}
