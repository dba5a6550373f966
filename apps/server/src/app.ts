import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from './config.ts';
import type { Mailer } from './mail/send-mail.ts';
import { healthRoutes } from './health/routes.ts';
import { apiNotFound, errorMiddleware } from './errors/error-middleware.ts';
import { serveWeb } from './http/serve-web.ts';
import type { Services } from './services.ts';
import { createPasswordHasher } from './auth/passwords.ts';
import { sessionMiddleware, sessionTimeouts } from './auth/session.ts';
import { createCsrf } from './auth/csrf.ts';
import { authRoutes } from './auth/routes.ts';
import { accountRoutes } from './auth/account-routes.ts';
import { requestContext } from './audit/request-context.ts';
import { invitationPublicRoutes } from './invitations/routes.ts';
import { orgRoutes } from './orgs/routes.ts';
import { recordRoutes } from './records/routes.ts';
import { calcRoutes } from './calc/routes.ts';
import { MAX_DRAFT_BYTES } from '@biasproof/shared';

export interface AppDeps {
  config: AppConfig;
  sequelize: Sequelize;
  logger: Logger;
  mailer: Mailer;
}

/** Builds the Express app without listening, so tests drive it with supertest. */
export function createApp({ config, sequelize, logger, mailer }: AppDeps): Express {
  const svc: Services = {
    config,
    sequelize,
    logger,
    mailer,
    passwords: createPasswordHasher(config.argon2),
  };
  const app = express();
  app.disable('x-powered-by');
  // Behind one reverse proxy, its X-Forwarded-For names the client (per-address sign-in throttling).
  app.set('trust proxy', config.trustProxy ? 1 : false);
  app.use(
    helmet({
      // HSTS on plain-HTTP localhost would pin browsers to https for the host; only send it
      // when the deployment says cookies are secure (i.e. served over TLS).
      strictTransportSecurity: config.cookieSecure,
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'style-src': ["'self'", "'unsafe-inline'"],
          'upgrade-insecure-requests': config.cookieSecure ? [] : null,
        },
      },
    }),
  );
  app.use(pinoHttp({ logger, autoLogging: { ignore: (req) => req.url === '/api/health' } }));
  // Drafts sent to the engine unsaved get a tighter cap than other bodies (413 beyond it).
  app.use('/api/calc', express.json({ limit: MAX_DRAFT_BYTES }));
  app.use(express.json({ limit: '1mb' }));

  const api = express.Router();
  api.use(healthRoutes(sequelize));
  const csrf = createCsrf(config);
  api.use(
    sessionMiddleware(config, sequelize, logger),
    sessionTimeouts(config),
    ...csrf.middleware,
  );
  // After the session store (whose callbacks would drop it): the client's address and user
  // agent for the audit events this request writes.
  api.use(requestContext());
  api.use('/auth', authRoutes(svc, csrf));
  api.use('/account', accountRoutes(svc));
  api.use('/invitations', invitationPublicRoutes(svc, csrf));
  // Record downloads go first: `worksheets/export.csv` is not a worksheet id.
  api.use('/orgs/:orgId/worksheets', recordRoutes(svc));
  api.use('/orgs/:orgId', orgRoutes(svc));
  api.use('/calc', calcRoutes(svc));
  api.use(apiNotFound);
  app.use('/api', api);

  if (config.webDist) app.use(serveWeb(config.webDist));
  app.use(errorMiddleware(logger));
  return app;
}
