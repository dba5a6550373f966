import { afterAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import { migrateToLatest } from '../migrator.ts';

describe('migrations', () => {
  const t = createTestApp();
  afterAll(() => t.close());

  it('when the run database was migrated, then migrating again applies nothing', async () => {
    expect(await migrateToLatest(t.sequelize)).toEqual([]);
  });

  it('when migrated, then the session table exists with its expiry index', async () => {
    const [rows] = await t.sequelize.query(
      "SELECT indexname FROM pg_indexes WHERE tablename = 'session' ORDER BY indexname",
    );
    expect((rows as { indexname: string }[]).map((r) => r.indexname)).toEqual(['session_expire_idx', 'session_pkey']);
  });
});
