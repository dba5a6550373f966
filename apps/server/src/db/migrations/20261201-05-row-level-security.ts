import type { MigrationContext } from '../migrator.ts';

// A second wall behind the tenant middleware: rows of organization-owned tables are visible
// only inside a transaction whose `biasproof.org_id` setting names their organization (set by
// db/transactions.ts), or is `*` for the few system paths. Outside such a transaction nothing
// is visible, so a forgotten scope fails closed. FORCE applies the policies to the tables'
// owner, which is the role the app connects as.
const tables = ['organizations', 'memberships', 'invitations', 'audit_events', 'audit_chain_heads'];

export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE FUNCTION biasproof_scope_is_system() RETURNS boolean LANGUAGE sql STABLE AS $$
      SELECT coalesce(current_setting('biasproof.org_id', true), '') = '*'
    $$;
    CREATE FUNCTION biasproof_scope_org() RETURNS uuid LANGUAGE sql STABLE AS $$
      SELECT CASE WHEN s ~ '^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$' THEN s::uuid END
        FROM coalesce(current_setting('biasproof.org_id', true), '') AS s
    $$;

    CREATE POLICY tenant_scope ON organizations
      USING (biasproof_scope_is_system() OR id = biasproof_scope_org());
    CREATE POLICY tenant_scope ON memberships
      USING (biasproof_scope_is_system() OR org_id = biasproof_scope_org());
    CREATE POLICY tenant_scope ON invitations
      USING (biasproof_scope_is_system() OR org_id = biasproof_scope_org());
    -- An organization's audit listing also shows account events (org_id NULL) of its members.
    CREATE POLICY tenant_scope ON audit_events
      USING (biasproof_scope_is_system() OR org_id = biasproof_scope_org()
             OR (org_id IS NULL AND biasproof_scope_org() IS NOT NULL))
      WITH CHECK (biasproof_scope_is_system() OR org_id = biasproof_scope_org());
    CREATE POLICY tenant_scope ON audit_chain_heads
      USING (biasproof_scope_is_system() OR chain = biasproof_scope_org()::text);
  `);
  for (const table of tables) {
    await sequelize.query(
      `ALTER TABLE ${table} ENABLE ROW LEVEL SECURITY; ALTER TABLE ${table} FORCE ROW LEVEL SECURITY;`,
    );
  }
}

export async function down({ sequelize }: MigrationContext): Promise<void> {
  for (const table of tables) {
    await sequelize.query(`DROP POLICY IF EXISTS tenant_scope ON ${table}; ALTER TABLE ${table} NO FORCE ROW LEVEL SECURITY;
      ALTER TABLE ${table} DISABLE ROW LEVEL SECURITY;`);
  }
  await sequelize.query(
    'DROP FUNCTION IF EXISTS biasproof_scope_org(); DROP FUNCTION IF EXISTS biasproof_scope_is_system();',
  );
}
