import type { MigrationContext } from '../migrator.ts';

// The transactional outbox: a change writes the e-mails it triggers in its own transaction,
// and the dispatcher in the server process sends them later, retrying with backoff while SMTP
// is down. A row is sent when `sent_at` is set; the dispatcher locks rows (SKIP LOCKED) so two
// dispatchers never send the same message. Same row-level security as the other tenant tables.
export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE TABLE outbox_messages (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      org_id uuid NOT NULL REFERENCES organizations (id) ON DELETE CASCADE,
      kind text NOT NULL,
      to_address text NOT NULL CHECK (position('@' in to_address) > 1),
      subject text NOT NULL,
      text_body text NOT NULL,
      html_body text,
      attempts integer NOT NULL DEFAULT 0 CHECK (attempts >= 0),
      next_attempt_at timestamptz NOT NULL DEFAULT now(),
      last_error text,
      sent_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX outbox_messages_due_idx ON outbox_messages (next_attempt_at) WHERE sent_at IS NULL;
    CREATE INDEX outbox_messages_org_idx ON outbox_messages (org_id, created_at);

    CREATE POLICY tenant_scope ON outbox_messages
      USING (biasproof_scope_is_system() OR org_id = biasproof_scope_org());
    ALTER TABLE outbox_messages ENABLE ROW LEVEL SECURITY;
    ALTER TABLE outbox_messages FORCE ROW LEVEL SECURITY;
  `);
}

export async function down({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query('DROP TABLE IF EXISTS outbox_messages;');
}
