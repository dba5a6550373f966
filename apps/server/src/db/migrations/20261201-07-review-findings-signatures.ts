import type { MigrationContext } from '../migrator.ts';

// Review and sign-off: findings pinned to a number of a revision with their reply thread, and
// electronic signatures of a revision's content hash. Same row-level security as migration 06;
// composite foreign keys keep each row in its worksheet's organization. A signature is never
// changed except to mark it superseded by a later signed revision, and never deleted.
const tables = ['findings', 'finding_replies', 'signatures'];

export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    -- Who accepted the current revision: its checker for separation of duties at sign-off.
    ALTER TABLE worksheets ADD COLUMN checked_by_user_id uuid REFERENCES users (id);

    CREATE TABLE findings (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      org_id uuid NOT NULL,
      worksheet_id uuid NOT NULL,
      revision_letter text NOT NULL,
      path text NOT NULL CHECK (path ~ '^[A-Za-z0-9_$-]+([.][A-Za-z0-9_$-]+)*$' AND length(path) <= 200),
      severity text NOT NULL CHECK (severity IN ('note', 'minor', 'major')),
      text text NOT NULL CHECK (length(trim(text)) > 0 AND length(text) <= 4000),
      status text NOT NULL DEFAULT 'open' CHECK (status IN ('open', 'answered', 'closed')),
      created_by_user_id uuid NOT NULL REFERENCES users (id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (org_id, id),
      FOREIGN KEY (org_id, worksheet_id) REFERENCES worksheets (org_id, id) ON DELETE CASCADE,
      FOREIGN KEY (worksheet_id, revision_letter) REFERENCES revisions (worksheet_id, letter)
    );
    CREATE INDEX findings_worksheet_idx ON findings (org_id, worksheet_id, created_at);

    CREATE TABLE finding_replies (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      org_id uuid NOT NULL,
      finding_id uuid NOT NULL,
      kind text NOT NULL CHECK (kind IN ('answer', 'close', 'reopen')),
      text text NOT NULL DEFAULT '' CHECK (length(text) <= 4000),
      created_by_user_id uuid NOT NULL REFERENCES users (id),
      created_at timestamptz NOT NULL DEFAULT now(),
      FOREIGN KEY (org_id, finding_id) REFERENCES findings (org_id, id) ON DELETE CASCADE
    );
    CREATE INDEX finding_replies_finding_idx ON finding_replies (org_id, finding_id, created_at);

    CREATE TABLE signatures (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      org_id uuid NOT NULL,
      worksheet_id uuid NOT NULL,
      revision_letter text NOT NULL,
      user_id uuid NOT NULL REFERENCES users (id),
      printed_name text NOT NULL,
      meaning text NOT NULL CHECK (length(trim(meaning)) > 0),
      content_hash text NOT NULL CHECK (content_hash ~ '^[0-9a-f]{64}$'),
      signed_at timestamptz NOT NULL,
      superseded_at timestamptz,
      FOREIGN KEY (org_id, worksheet_id) REFERENCES worksheets (org_id, id),
      FOREIGN KEY (worksheet_id, revision_letter) REFERENCES revisions (worksheet_id, letter)
    );
    CREATE INDEX signatures_worksheet_idx ON signatures (org_id, worksheet_id, signed_at);

    CREATE FUNCTION biasproof_signature_guard() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP = 'UPDATE' AND OLD.superseded_at IS NULL AND NEW.superseded_at IS NOT NULL
         AND (to_jsonb(NEW) - 'superseded_at') = (to_jsonb(OLD) - 'superseded_at') THEN
        RETURN NEW;
      END IF;
      RAISE EXCEPTION 'signature % cannot be changed or removed', OLD.id
        USING ERRCODE = 'check_violation';
    END $$;
    CREATE TRIGGER signatures_guard BEFORE UPDATE OR DELETE ON signatures
      FOR EACH ROW EXECUTE FUNCTION biasproof_signature_guard();
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
    DROP TABLE IF EXISTS signatures;
    DROP FUNCTION IF EXISTS biasproof_signature_guard();
    DROP TABLE IF EXISTS finding_replies;
    DROP TABLE IF EXISTS findings;
    ALTER TABLE worksheets DROP COLUMN IF EXISTS checked_by_user_id;
  `);
}
