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

export interface AppDeps {
  config: AppConfig;
  sequelize: Sequelize;
  logger: Logger;
  mailer: Mailer;
}

/** Builds the Express app without listening, so tests drive it with supertest. */
export function createApp({ config, sequelize, logger }: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', false);
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
  app.use(express.json({ limit: '1mb' }));

  const api = express.Router();
  api.use(healthRoutes(sequelize));
  api.use(apiNotFound);
  app.use('/api', api);

  if (config.webDist) app.use(serveWeb(config.webDist));
  app.use(errorMiddleware(logger));
  return app;
}
