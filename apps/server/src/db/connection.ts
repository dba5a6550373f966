import { Sequelize } from 'sequelize';
import type { Logger } from 'pino';

/** Opens the Sequelize connection pool over pg. Short timeouts so a dead database is reported, not waited on. */
export function createSequelize(databaseUrl: string, logger?: Logger): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    logging: logger ? (sql: string) => logger.trace({ sql }, 'sql') : false,
    pool: { max: 10, min: 0, acquire: 5_000, idle: 10_000 },
    dialectOptions: { connectionTimeoutMillis: 3_000 },
    define: { underscored: true },
  });
}
