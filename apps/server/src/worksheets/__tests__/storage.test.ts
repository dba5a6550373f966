import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../../test-support/test-app.ts';
import { systemRows } from '../../test-support/fixtures.ts';
import { createOrgWorld, type OrgWorld } from '../../test-support/org-routes.ts';
import { createOrgContext } from '../../orgs/org-scope.ts';

const tables = ['model_library_entries', 'projects', 'revisions', 'worksheets'];

describe('worksheet storage', () => {
  const t = createTestApp();
  let home: OrgWorld;
  let away: OrgWorld;
  beforeAll(async () => {
    home = await createOrgWorld(t, ['author']);
    away = await createOrgWorld(t, ['author']);
  });
  afterAll(() => t.close());

  it('when migrated, then projects, worksheets, revisions and models enforce row-level security, even for their owner', async () => {
    const [rows] = await t.sequelize.query(
      `SELECT relname, relrowsecurity, relforcerowsecurity FROM pg_class WHERE relname = ANY ($1) ORDER BY relname`,
      { bind: [tables] },
    );
    expect(rows).toEqual(
      tables.map((relname) => ({ relname, relrowsecurity: true, relforcerowsecurity: true })),
    );
  });

  it('when a query inside one organization’s scope forgets its filter, then it sees only that organization’s rows', async () => {
    const org = createOrgContext(t.sequelize, home.org.id, {
      userId: home.actorId,
      roles: ['author'],
    });
    const seen = await org.read(async (tx) => ({
      projects: await tx.models.Project.findAll({ transaction: tx.transaction }),
      worksheets: await tx.models.Worksheet.findAll({ transaction: tx.transaction }),
      revisions: await tx.models.Revision.findAll({ transaction: tx.transaction }),
      models: await tx.models.ModelLibraryEntry.findAll({ transaction: tx.transaction }),
    }));
    expect(seen.projects.map((r) => r.id)).toEqual([home.projectId]);
    expect(seen.worksheets.map((r) => r.id).sort()).toEqual(
      [
        home.worksheetId,
        home.assignedWorksheetId,
        home.inCheckWorksheetId,
        home.checkedWorksheetId,
        home.signedWorksheetId,
      ].sort(),
    );
    expect(new Set(seen.revisions.map((r) => r.orgId))).toEqual(new Set([home.org.id]));
    expect(seen.models.map((r) => r.id)).toEqual([home.modelId]);
  });

  it('when a write inside one organization’s scope names another organization’s project, then PostgreSQL refuses it', async () => {
    const org = createOrgContext(t.sequelize, home.org.id, {
      userId: home.actorId,
      roles: ['author'],
    });
    await expect(
      org.write((tx) =>
        tx.models.Worksheet.create(
          {
            orgId: home.org.id,
            projectId: away.projectId,
            title: 'Cross',
            authorUserId: home.actorId,
          },
          { transaction: tx.transaction },
        ),
      ),
    ).rejects.toThrow(/foreign key/);
    await expect(
      org.write((tx) =>
        tx.models.Project.create(
          { orgId: away.org.id, name: 'Planted', code: 'PLANT', createdByUserId: home.actorId },
          { transaction: tx.transaction },
        ),
      ),
    ).rejects.toThrow(/row-level security/);
  });

  it('when a frozen revision is updated or deleted directly, then the database refuses it', async () => {
    await systemRows(t, 'UPDATE revisions SET frozen = true WHERE worksheet_id = $1 RETURNING id', [
      home.worksheetId,
    ]);
    await expect(
      systemRows(
        t,
        `UPDATE revisions SET engine_version = 'x' WHERE worksheet_id = $1 RETURNING id`,
        [home.worksheetId],
      ),
    ).rejects.toThrow(/frozen/);
    await expect(
      systemRows(t, 'DELETE FROM revisions WHERE worksheet_id = $1 RETURNING id', [
        home.worksheetId,
      ]),
    ).rejects.toThrow(/frozen/);
    const [row] = await systemRows(
      t,
      'SELECT frozen, engine_version FROM revisions WHERE worksheet_id = $1',
      [home.worksheetId],
    );
    expect(row).toEqual({ frozen: true, engine_version: '0.0.0-fixture' });
  });
});
