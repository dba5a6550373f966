import type { MigrationContext } from '../migrator.ts';

// Projects, worksheets, their revisions and the organization's model library. Every table
// carries org_id under the same row-level security policy as the account tables (migration
// 05); composite foreign keys (org_id, id) keep a worksheet in its project's organization and
// a revision in its worksheet's. A frozen revision is refused any UPDATE or DELETE by a
// trigger, whatever the application does.
const tables = ['projects', 'worksheets', 'revisions', 'model_library_entries'];

export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE TABLE projects (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      org_id uuid NOT NULL REFERENCES organizations (id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(trim(name)) > 0 AND length(name) <= 120),
      code text NOT NULL CHECK (code ~ '^[A-Z0-9][A-Z0-9_.-]{0,19}$'),
      description text NOT NULL DEFAULT '',
      archived boolean NOT NULL DEFAULT false,
      created_by_user_id uuid NOT NULL REFERENCES users (id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (org_id, code),
      UNIQUE (org_id, id)
    );

    CREATE TABLE worksheets (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      org_id uuid NOT NULL REFERENCES organizations (id) ON DELETE CASCADE,
      project_id uuid NOT NULL,
      title text NOT NULL CHECK (length(trim(title)) > 0 AND length(title) <= 200),
      description text NOT NULL DEFAULT '',
      author_user_id uuid NOT NULL REFERENCES users (id),
      checker_user_id uuid REFERENCES users (id),
      approver_user_id uuid REFERENCES users (id),
      state text NOT NULL DEFAULT 'draft' CHECK (state IN
        ('draft', 'in_check', 'checked', 'signed_off', 'returned', 'withdrawn', 'superseded')),
      current_revision text NOT NULL DEFAULT 'A' CHECK (current_revision ~ '^[A-Z]{1,3}$'),
      version integer NOT NULL DEFAULT 1 CHECK (version >= 1),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (org_id, id),
      FOREIGN KEY (org_id, project_id) REFERENCES projects (org_id, id)
    );
    CREATE INDEX worksheets_project_idx ON worksheets (org_id, project_id);
    CREATE INDEX worksheets_updated_idx ON worksheets (org_id, updated_at DESC);
    CREATE INDEX worksheets_author_idx ON worksheets (org_id, author_user_id);

    CREATE TABLE revisions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      org_id uuid NOT NULL,
      worksheet_id uuid NOT NULL,
      letter text NOT NULL CHECK (letter ~ '^[A-Z]{1,3}$'),
      circuit jsonb NOT NULL,
      settings jsonb NOT NULL,
      -- Non-finite numbers are stored as the strings "Infinity", "-Infinity", "NaN" (canonical-json.ts).
      results jsonb NOT NULL,
      -- results->>'status', kept beside them so that lists need not read the results.
      result_status text NOT NULL CHECK (result_status IN ('solved', 'failed', 'empty')),
      engine_version text NOT NULL,
      content_hash text NOT NULL CHECK (content_hash ~ '^[0-9a-f]{64}$'),
      frozen boolean NOT NULL DEFAULT false,
      created_by_user_id uuid NOT NULL REFERENCES users (id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (worksheet_id, letter),
      FOREIGN KEY (org_id, worksheet_id) REFERENCES worksheets (org_id, id) ON DELETE CASCADE
    );

    CREATE FUNCTION biasproof_frozen_revision_guard() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'revision % of worksheet % is frozen', OLD.letter, OLD.worksheet_id
        USING ERRCODE = 'check_violation';
    END $$;
    CREATE TRIGGER revisions_frozen_guard BEFORE UPDATE OR DELETE ON revisions
      FOR EACH ROW WHEN (OLD.frozen) EXECUTE FUNCTION biasproof_frozen_revision_guard();

    CREATE TABLE model_library_entries (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      org_id uuid NOT NULL REFERENCES organizations (id) ON DELETE CASCADE,
      name text NOT NULL CHECK (name ~ '^[A-Za-z][A-Za-z0-9_.-]{0,63}$'),
      kind text NOT NULL CHECK (kind IN ('D', 'NPN', 'PNP', 'NMOS', 'PMOS')),
      params jsonb NOT NULL DEFAULT '{}'::jsonb,
      ratings jsonb NOT NULL DEFAULT '{}'::jsonb,
      notes text NOT NULL DEFAULT '',
      created_by_user_id uuid NOT NULL REFERENCES users (id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE UNIQUE INDEX model_library_entries_name_key ON model_library_entries (org_id, lower(name));
  `);
  for (const table of tables) {
    await sequelize.query(`
      CREATE POLICY tenant_scope ON ${table}
        USING (biasproof_scope_is_system() OR org_id = biasproof_scope_org());
      ALTER TABLE ${table} ENABLE ROW LEVEL SECURITY;
      ALTER TABLE ${table} FORCE ROW LEVEL SECURITY;
    `);
  }
}

export async function down({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    DROP TABLE IF EXISTS model_library_entries;
    DROP TABLE IF EXISTS revisions;
    DROP FUNCTION IF EXISTS biasproof_frozen_revision_guard();
    DROP TABLE IF EXISTS worksheets;
    DROP TABLE IF EXISTS projects;
  `);
}
