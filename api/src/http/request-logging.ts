import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';

const acceptedRequestId = /^[\w.:-]{1,100}$/;

/** Takes a sane X-Request-Id from a proxy, or makes one; echoes it in the response. */
function requestId(req: IncomingMessage, res: ServerResponse): string {
  const given = req.headers['x-request-id'];
  const id = typeof given === 'string' && acceptedRequestId.test(given) ? given : randomUUID();
  res.setHeader('X-Request-Id', id);
  return id;
}

/** Express strips the mount path from req.url inside routers; originalUrl keeps it. */
function fullPath(req: IncomingMessage): string {
  return (req as IncomingMessage & { originalUrl?: string }).originalUrl ?? req.url ?? '';
}

/** One log line per request with its id, method, path, status and time; req.log carries the id for handlers. */
export function requestLogging(logger: Logger) {
  return pinoHttp({
    logger,
    genReqId: requestId,
    customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
    customSuccessMessage: (req, res) => `${req.method} ${fullPath(req)} ${res.statusCode}`,
    customErrorMessage: (req, res) => `${req.method} ${fullPath(req)} ${res.statusCode}`,
    serializers: {
      req: (req: { id: string; method: string; url: string; remoteAddress?: string }) => ({
        id: req.id,
        method: req.method,
        url: req.url,
        remoteAddress: req.remoteAddress,
      }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
  });
}
