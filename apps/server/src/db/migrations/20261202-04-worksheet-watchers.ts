import type { MigrationContext } from '../migrator.ts';

// People who asked to hear when a worksheet is signed off, beside its author and checker.
// Same row-level security as the other tenant tables; the composite foreign key keeps a
// watcher row in its worksheet's organization.
export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE TABLE worksheet_watchers (
      org_id uuid NOT NULL,
      worksheet_id uuid NOT NULL,
      user_id uuid NOT NULL REFERENCES users (id),
      created_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (worksheet_id, user_id),
      FOREIGN KEY (org_id, worksheet_id) REFERENCES worksheets (org_id, id) ON DELETE CASCADE
    );
    CREATE POLICY tenant_scope ON worksheet_watchers
      USING (biasproof_scope_is_system() OR org_id = biasproof_scope_org());
    ALTER TABLE worksheet_watchers ENABLE ROW LEVEL SECURITY;
    ALTER TABLE worksheet_watchers FORCE ROW LEVEL SECURITY;
  `);
}

export async function down({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query('DROP TABLE IF EXISTS worksheet_watchers;');
}
