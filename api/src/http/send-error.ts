import type { Response } from 'express';
import type { ApiError, ErrorCode } from '../../../shared/schemas/api-error.js';

/** Writes the one JSON error shape every API route answers with. */
export function sendError(res: Response, status: number, code: ErrorCode, message: string, fields?: Record<string, string>): void {
  const body: ApiError = { error: { code, message, ...(fields ? { fields } : {}) } };
  res.status(status).json(body);
}
