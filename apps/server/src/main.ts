// The only module that listens. Loads the configuration, migrates, serves, and shuts down
// cleanly on SIGTERM/SIGINT.
import type { Server } from 'node:http';
import { ConfigError, loadConfig } from './config.ts';
import { createLogger } from './logger.ts';
import { createSequelize } from './db/connection.ts';
import { migrateToLatest } from './db/migrator.ts';
import { createMailTransport } from './mail/mail-transport.ts';
import { createMailer } from './mail/send-mail.ts';
import { createApp } from './app.ts';
import { startOutboxDispatcher } from './outbox/dispatcher.ts';

function readConfig() {
  try {
    return loadConfig();
  } catch (e) {
    if (e instanceof ConfigError) {
      console.error(e.message);
      process.exit(1);
    }
    throw e;
  }
}

const config = readConfig();
const logger = createLogger(config.logLevel);
const sequelize = createSequelize(config.databaseUrl);
const transport = createMailTransport(config.smtp);
const mailer = createMailer(transport, config.smtp.from);

const applied = await migrateToLatest(sequelize);
if (applied.length) logger.info({ applied }, 'migrations applied');

const app = createApp({ config, sequelize, logger, mailer });
const server: Server = app.listen(config.port, config.host, () => {
  logger.info({ url: `http://${config.host}:${config.port}` }, 'Biasproof server listening');
});

// E-mails written by changes (the outbox) are sent from this process, retried while SMTP is down.
const outbox = startOutboxDispatcher(sequelize, mailer, logger);

let stopping = false;
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'shutting down');
  const forced = setTimeout(() => process.exit(1), 10_000).unref();
  server.close();
  server.closeIdleConnections();
  await outbox.stop().catch(() => undefined);
  await sequelize.close().catch(() => undefined);
  transport.close();
  clearTimeout(forced);
  process.exit(0);
}

process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('unhandledRejection', (reason) => {
  logger.error({ err: reason }, 'unhandled promise rejection');
});
process.on('uncaughtException', (err) => {
  logger.fatal({ err }, 'uncaught exception; exiting');
  process.exit(1);
});
