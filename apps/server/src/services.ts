import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from './config.ts';
import type { Mailer } from './mail/send-mail.ts';
import type { PasswordHasher } from './auth/passwords.ts';

/** What use cases need from the outside world; built once per app in createApp. */
export interface Services {
  config: AppConfig;
  sequelize: Sequelize;
  logger: Logger;
  mailer: Mailer;
  passwords: PasswordHasher;
}
