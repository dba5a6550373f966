import type { Sequelize } from 'sequelize';
import type { HealthResponse } from '@biasproof/shared';
import { appVersion } from '../version.ts';

export type HealthReport = HealthResponse;

/** Asks the database for a trivial answer; any failure or a slow answer means it is down. */
export async function checkHealth(sequelize: Sequelize, timeoutMs = 3_000): Promise<HealthReport> {
  const probe = sequelize.query('SELECT 1').then(
    () => true,
    () => false,
  );
  const timeout = new Promise<boolean>((resolve) => setTimeout(resolve, timeoutMs, false).unref());
  const dbUp = await Promise.race([probe, timeout]);
  return { status: dbUp ? 'ok' : 'degraded', db: dbUp ? 'ok' : 'down', version: appVersion };
}
