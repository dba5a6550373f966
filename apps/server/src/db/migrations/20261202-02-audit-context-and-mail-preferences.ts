import type { MigrationContext } from '../migrator.ts';

// Audit context, e-mail delivery preferences and a safer outbox.
//
// audit_events gains what a reader of the log needs besides the bare action: the worksheet
// revision, a one-line summary, the project and worksheet the event concerns (filters), and
// the client's address and user agent. ALTER TABLE ADD COLUMN changes no row, so the
// append-only trigger stays as it is and fires for any later UPDATE. The columns are nullable:
// events written before this migration keep NULL there, and the hash covers a field only when
// it is not NULL (audit/hash-chain.ts), so their hashes still verify. project_id and
// worksheet_id carry no foreign key on purpose: a record of what happened must neither block
// nor follow later changes to the things it names.
//
// outbox_messages:
// - org_id becomes nullable for account messages (password reset) and the daily digest, which
//   belong to a person rather than an organization (account audit events have org_id NULL
//   too). The tenant_scope policy stays: `org_id = biasproof_scope_org()` is never true for
//   NULL, so such rows are visible and insertable in the system scope only, never from an
//   organization's transaction. A CHECK keeps organization messages from losing their org.
// - claim_token / claimed_until: the dispatcher claims a row for a lease in a short
//   transaction, sends it with no transaction open, then marks it sent if it still holds the
//   claim. A crash between SMTP's acceptance and that mark means a resend after the lease
//   ends; the Message-ID is derived from the row id, so the copy is recognizably the same
//   message (docs/api.md, "Mail").
// - link: the one link a message is about (listed in digests).
// - digest_id / digest_day: a message held for a daily digest is marked sent, naming the
//   digest row, in the transaction that writes the digest; one digest per address and day.
//
// mail_preferences: how each person receives workflow e-mail (immediately or a daily digest).
// A person's setting, not an organization's: no org_id and no row-level security, like users.
export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    ALTER TABLE audit_events
      ADD COLUMN revision text,
      ADD COLUMN summary text,
      ADD COLUMN project_id uuid,
      ADD COLUMN worksheet_id uuid,
      ADD COLUMN ip text,
      ADD COLUMN user_agent text;
    CREATE INDEX audit_events_org_project_idx ON audit_events (org_id, project_id, at)
      WHERE project_id IS NOT NULL;
    CREATE INDEX audit_events_org_worksheet_idx ON audit_events (org_id, worksheet_id, at)
      WHERE worksheet_id IS NOT NULL;

    ALTER TABLE outbox_messages
      ALTER COLUMN org_id DROP NOT NULL,
      ADD COLUMN link text,
      ADD COLUMN claim_token uuid,
      ADD COLUMN claimed_until timestamptz,
      ADD COLUMN digest_id uuid REFERENCES outbox_messages (id),
      ADD COLUMN digest_day date,
      ADD CONSTRAINT outbox_messages_org_or_personal
        CHECK (org_id IS NOT NULL OR kind LIKE 'account.%' OR kind LIKE 'digest.%');
    CREATE UNIQUE INDEX outbox_messages_one_digest_a_day
      ON outbox_messages (lower(to_address), digest_day) WHERE digest_day IS NOT NULL;
    CREATE INDEX outbox_messages_held_idx ON outbox_messages (lower(to_address), created_at)
      WHERE sent_at IS NULL;

    CREATE TABLE mail_preferences (
      user_id uuid PRIMARY KEY REFERENCES users (id) ON DELETE CASCADE,
      delivery text NOT NULL CHECK (delivery IN ('immediate', 'daily-digest')),
      digest_hour_utc smallint NOT NULL DEFAULT 7 CHECK (digest_hour_utc BETWEEN 0 AND 23),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
  `);
}

export async function down({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    DROP TABLE IF EXISTS mail_preferences;
    DROP INDEX IF EXISTS outbox_messages_held_idx;
    DROP INDEX IF EXISTS outbox_messages_one_digest_a_day;
    ALTER TABLE outbox_messages
      DROP CONSTRAINT IF EXISTS outbox_messages_org_or_personal,
      DROP COLUMN IF EXISTS digest_day,
      DROP COLUMN IF EXISTS digest_id,
      DROP COLUMN IF EXISTS claimed_until,
      DROP COLUMN IF EXISTS claim_token,
      DROP COLUMN IF EXISTS link;
    -- Row-level security hides rows outside the system scope, also from a migration.
    SELECT set_config('biasproof.org_id', '*', true);
    DELETE FROM outbox_messages WHERE org_id IS NULL;
    ALTER TABLE outbox_messages ALTER COLUMN org_id SET NOT NULL;
    DROP INDEX IF EXISTS audit_events_org_worksheet_idx;
    DROP INDEX IF EXISTS audit_events_org_project_idx;
    ALTER TABLE audit_events
      DROP COLUMN IF EXISTS user_agent,
      DROP COLUMN IF EXISTS ip,
      DROP COLUMN IF EXISTS worksheet_id,
      DROP COLUMN IF EXISTS project_id,
      DROP COLUMN IF EXISTS summary,
      DROP COLUMN IF EXISTS revision;
  `);
}
