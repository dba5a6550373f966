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

export interface TestAppOptions {
  databaseUrl?: string;
  /** Extra environment for loadConfig, e.g. `{ SESSION_IDLE_TIMEOUT_SECONDS: '1' }`. */
  env?: Record<string, string>;
}

/**
 * The real app over the run's real database and maildev; close() releases the pool.
 * Password hashing runs at a low argon2 cost so that tests stay fast.
 */
export function createTestApp(overrides: TestAppOptions = {}): TestApp {
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: overrides.databaseUrl ?? testEnv.databaseUrl,
    SMTP_PORT: String(testEnv.smtpPort),
    LOG_LEVEL: 'silent',
    APP_URL: 'http://biasproof.test.example',
    ARGON2_MEMORY_KIB: '256',
    ARGON2_TIME_COST: '1',
    ...overrides.env,
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
