import type { ErrorRequestHandler, RequestHandler } from 'express';
import { HttpError } from './http-error.js';
import { sendError } from './send-error.js';

interface ParserError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
}

/** Unknown /api paths answer in JSON, never with the web app's index page. */
export const apiNotFound: RequestHandler = (req, res) => {
  sendError(res, 404, 'not_found', `No API route ${req.method} ${req.originalUrl.split('?')[0]}.`);
};

/**
 * The last middleware: maps thrown errors to the JSON error shape. Details of unexpected errors go to the
 * log only, never to the client.
 */
export const errorHandler: ErrorRequestHandler = (err, req, res, next) => {
  if (res.headersSent) {
    next(err);
    return;
  }
  if (err instanceof HttpError) {
    sendError(res, err.status, err.code, err.message, err.fields);
    return;
  }
  const parser = err as ParserError;
  const status = parser.status ?? parser.statusCode;
  if (parser.type === 'entity.too.large') {
    sendError(res, 413, 'payload_too_large', 'The request body is too large.');
  } else if (parser.type === 'entity.parse.failed') {
    sendError(res, 400, 'bad_request', 'The request body is not valid JSON.');
  } else if (status && status >= 400 && status < 500 && parser.expose) {
    sendError(res, status, 'bad_request', 'The request could not be understood.');
  } else {
    req.log.error({ err }, 'request failed');
    sendError(res, 500, 'internal', 'Something went wrong on the server. It has been logged.');
  }
};
