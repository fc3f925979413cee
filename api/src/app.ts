import './auth/express-augment.js';
import { RequestContext, type MikroORM } from '@mikro-orm/postgresql';
import connectPgSimple from 'connect-pg-simple';
import type { Server } from 'node:http';
import express, { Router, type Express, type RequestHandler } from 'express';
import session from 'express-session';
import pg from 'pg';
import type { Logger } from 'pino';
import { requireCsrfToken } from './auth/csrf-token.js';
import { createPassport } from './auth/passport-setup.js';
import { requireRole } from './auth/require-role.js';
import type { ApiConfig } from './config.js';
import { apiNotFound, errorHandler } from './http/error-handler.js';
import { requestLogging } from './http/request-logging.js';
import { securityHeaders } from './http/security-headers.js';
import { adminAuditEventsRouter } from './routes/admin-audit-events.js';
import { adminTeamsRouter } from './routes/admin-teams.js';
import { adminUsersRouter } from './routes/admin-users.js';
import { adminMailboxRouter } from './routes/admin-mailbox.js';
import { adminWorkersRouter } from './routes/admin-workers.js';
import { adminAllowancesRouter, ownAllowanceRouter } from './routes/allowances.js';
import { candidateSetsRouter, projectCandidateSetsRouter } from './routes/candidate-sets.js';
import { projectRecordingsRouter, recordingsRouter } from './routes/recordings.js';
import { projectSweepsRouter, sweepsRouter } from './routes/sweeps.js';
import { sweepModelsRouter } from './routes/sweep-models.js';
import { ModelDetailsPool } from './models/model-details-pool.js';
import { QueueClient } from './queue/queue-client.js';
import { LiveHub } from './live/live-hub.js';
import { healthRouter } from './routes/health.js';
import { projectsRouter } from './routes/projects.js';
import { sessionRouter } from './routes/session.js';
import { defaultWebDir, webAppRouter } from './web/web-app.js';

export type AppConfig = Pick<
  ApiConfig,
  | 'databaseUrl'
  | 'sessionSecret'
  | 'webDir'
  | 'loginLimit'
  | 'loginWindowMs'
  | 'trustProxy'
  | 'https'
  | 'uploadLimitBytes'
  | 'allowanceDefaults'
  | 'publicUrl'
>;

export interface ConservaApp {
  app: Express;
  /** Serves the live view (/ws) on the HTTP server the app runs on. */
  attachLive(server: Server): void;
  /** Closes the live sockets (they would keep the HTTP server from closing). */
  closeLive(): Promise<void>;
  /** The session middleware, for the WebSocket upgrade to read the same sessions. */
  sessionMiddleware: RequestHandler;
  /** Releases what the app holds besides the ORM (the session store's pool). */
  close(): Promise<void>;
}

const sessionMaxAgeMs = 12 * 60 * 60 * 1000;

function createSessionMiddleware(config: AppConfig, pool: pg.Pool): RequestHandler {
  const PgStore = connectPgSimple(session);
  return session({
    store: new PgStore({ pool, tableName: 'session', createTableIfMissing: false }),
    secret: config.sessionSecret,
    name: 'conserva.sid',
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: sessionMaxAgeMs },
  });
}

/** Builds the Express app (without listening): API under /api, the web app everywhere else. */
export function createApp(orm: MikroORM, config: AppConfig, logger: Logger): ConservaApp {
  const sessionPool = new pg.Pool({ connectionString: config.databaseUrl, max: 4 });
  sessionPool.on('error', (err) => logger.error({ err }, 'session store connection failed'));
  const sessionMiddleware = createSessionMiddleware(config, sessionPool);
  const passport = createPassport(orm);
  const queue = new QueueClient(config.databaseUrl, logger);
  const live = new LiveHub(orm, sessionMiddleware, config.databaseUrl, logger);
  const models = new ModelDetailsPool();

  const app = express();
  app.set('trust proxy', config.trustProxy);
  app.use(securityHeaders(config.https));
  app.use(requestLogging(logger));

  const api = Router();
  api.use('/health', healthRouter(orm));
  api.use(express.json({ limit: '1mb' }));
  api.use((_req, _res, next) => RequestContext.create(orm.em, next));
  api.use(sessionMiddleware);
  api.use(passport.initialize());
  api.use(passport.session());
  api.use(requireCsrfToken);
  api.use('/session', sessionRouter(orm, passport, { limit: config.loginLimit, windowMs: config.loginWindowMs }, (userId) => live.closeUser(userId)));
  api.use('/projects/:projectId/recordings', projectRecordingsRouter(orm, config.uploadLimitBytes));
  api.use('/projects/:projectId/candidate-sets', projectCandidateSetsRouter(orm));
  api.use('/projects/:projectId/sweeps', projectSweepsRouter(orm, queue, { allowanceDefaults: config.allowanceDefaults }));
  api.use('/projects', projectsRouter(orm));
  api.use('/recordings', recordingsRouter(orm));
  api.use('/candidate-sets', candidateSetsRouter(orm));
  api.use('/sweeps', sweepsRouter(orm, queue));
  api.use('/sweeps', sweepModelsRouter(orm, models));
  api.use('/allowance', ownAllowanceRouter(orm, config.allowanceDefaults));
  api.use('/admin', requireRole('admin'));
  api.use('/admin/teams', adminTeamsRouter(orm));
  api.use('/admin/users', adminUsersRouter(orm, (userId) => live.closeUser(userId, 'account changed')));
  api.use('/admin/audit-events', adminAuditEventsRouter(orm));
  api.use('/admin/allowances', adminAllowancesRouter(orm, config.allowanceDefaults));
  api.use('/admin/mailbox', adminMailboxRouter(orm));
  api.use('/admin/workers', adminWorkersRouter(orm));
  api.use(apiNotFound);
  api.use(errorHandler);
  app.use('/api', api);

  app.use(webAppRouter(config.webDir ?? defaultWebDir));
  app.use(errorHandler);

  return {
    app,
    sessionMiddleware,
    attachLive: (server) => live.attach(server),
    closeLive: () => live.close(),
    async close() {
      await live.close();
      await queue.close();
      await models.destroy();
      await sessionPool.end();
    },
  };
}
