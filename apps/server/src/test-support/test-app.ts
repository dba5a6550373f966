import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { loadConfig, type AppConfig } from '../config.ts';
import { createApp } from '../app.ts';
import { createSequelize } from '../db/connection.ts';
import { createLogger } from '../logger.ts';
import { createMailTransport } from '../mail/mail-transport.ts';
import { createMailer, type Mailer } from '../mail/send-mail.ts';
import { testEnv } from './test-env.ts';

export interface TestApp {
  app: Express;
  sequelize: Sequelize;
  mailer: Mailer;
  config: AppConfig;
  close(): Promise<void>;
}

/** The real app over the run's real database and maildev; close() releases the pool. */
export function createTestApp(overrides: { databaseUrl?: string } = {}): TestApp {
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: overrides.databaseUrl ?? testEnv.databaseUrl,
    SMTP_PORT: String(testEnv.smtpPort),
    LOG_LEVEL: 'silent',
  });
  const sequelize = createSequelize(config.databaseUrl);
  const transport = createMailTransport(config.smtp);
  const mailer = createMailer(transport, config.smtp.from);
  const app = createApp({ config, sequelize, logger: createLogger('silent'), mailer });
  return {
    app,
    sequelize,
    mailer,
    config,
    async close() {
      transport.close();
      await sequelize.close();
    },
  };
}
