import type { MigrationContext } from '../migrator.ts';

// Files attached to a worksheet or to one of its findings, stored in PostgreSQL with their
// SHA-256 and size (checked against the bytes here, so a stored hash cannot disagree with the
// content). Same row-level security as migration 06; composite foreign keys keep an attachment
// in its worksheet's organization and a finding's attachment on that finding's worksheet.
// Attachments of a frozen revision are part of the record: never changed, never deleted.
export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    ALTER TABLE findings ADD CONSTRAINT findings_org_worksheet_id_key UNIQUE (org_id, worksheet_id, id);

    CREATE TABLE attachments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      org_id uuid NOT NULL,
      worksheet_id uuid NOT NULL,
      finding_id uuid,
      revision_letter text NOT NULL,
      filename text NOT NULL CHECK (length(filename) BETWEEN 1 AND 200),
      type text NOT NULL CHECK (type IN ('pdf', 'png', 'jpeg', 'csv', 'deck')),
      content_type text NOT NULL,
      size integer NOT NULL CHECK (size BETWEEN 0 AND 20971520),
      sha256 text NOT NULL CHECK (sha256 ~ '^[0-9a-f]{64}$'),
      content bytea NOT NULL,
      uploaded_by_user_id uuid NOT NULL REFERENCES users (id),
      uploaded_at timestamptz NOT NULL DEFAULT now(),
      CHECK (octet_length(content) = size AND encode(sha256(content), 'hex') = sha256),
      FOREIGN KEY (org_id, worksheet_id) REFERENCES worksheets (org_id, id) ON DELETE CASCADE,
      FOREIGN KEY (worksheet_id, revision_letter) REFERENCES revisions (worksheet_id, letter),
      FOREIGN KEY (org_id, worksheet_id, finding_id)
        REFERENCES findings (org_id, worksheet_id, id) ON DELETE CASCADE
    );
    CREATE INDEX attachments_worksheet_idx ON attachments (org_id, worksheet_id, uploaded_at);

    CREATE FUNCTION biasproof_attachment_guard() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP = 'DELETE' AND NOT EXISTS (
        SELECT 1 FROM revisions r
         WHERE r.worksheet_id = OLD.worksheet_id AND r.letter = OLD.revision_letter AND r.frozen
      ) THEN
        RETURN OLD;
      END IF;
      RAISE EXCEPTION 'attachment % cannot be changed, or removed from a frozen revision', OLD.id
        USING ERRCODE = 'check_violation';
    END $$;
    CREATE TRIGGER attachments_guard BEFORE UPDATE OR DELETE ON attachments
      FOR EACH ROW EXECUTE FUNCTION biasproof_attachment_guard();

    CREATE POLICY tenant_scope ON attachments
      USING (biasproof_scope_is_system() OR org_id = biasproof_scope_org());
    ALTER TABLE attachments ENABLE ROW LEVEL SECURITY;
    ALTER TABLE attachments FORCE ROW LEVEL SECURITY;
  `);
}

export async function down({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    DROP TABLE IF EXISTS attachments;
    DROP FUNCTION IF EXISTS biasproof_attachment_guard();
    ALTER TABLE findings DROP CONSTRAINT IF EXISTS findings_org_worksheet_id_key;
  `);
}
