import type { MigrationContext } from '../migrator.ts';

// The tamper-evident audit log: one hash chain per organization (org_id) and one for account
// events (org_id NULL). Each event's hash covers its canonical JSON and the previous event's
// hash; audit_chain_heads holds each chain's last event, is row-locked to serialize appends
// and lets verification notice a removed tail. A trigger makes events append-only.
export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE TABLE audit_events (
      id uuid PRIMARY KEY,
      org_id uuid REFERENCES organizations (id),
      seq bigint NOT NULL CHECK (seq >= 1),
      at timestamptz NOT NULL,
      actor_user_id uuid REFERENCES users (id),
      action text NOT NULL,
      target_type text NOT NULL,
      target_id text,
      details jsonb NOT NULL DEFAULT '{}'::jsonb,
      prev_hash text NOT NULL,
      hash text NOT NULL
    );
    CREATE UNIQUE INDEX audit_events_chain_seq_key ON audit_events ((coalesce(org_id::text, 'account')), seq);
    CREATE INDEX audit_events_org_at_idx ON audit_events (org_id, at);
    CREATE INDEX audit_events_target_idx ON audit_events (target_type, target_id) WHERE org_id IS NULL;

    CREATE TABLE audit_chain_heads (
      chain text PRIMARY KEY,
      last_seq bigint NOT NULL DEFAULT 0,
      last_hash text NOT NULL DEFAULT '',
      last_event_id uuid
    );

    CREATE FUNCTION audit_events_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'audit_events is append-only (% refused)', TG_OP USING ERRCODE = 'insufficient_privilege';
    END;
    $$;
    CREATE TRIGGER audit_events_no_update_or_delete
      BEFORE UPDATE OR DELETE ON audit_events
      FOR EACH ROW EXECUTE FUNCTION audit_events_append_only();
    CREATE TRIGGER audit_events_no_truncate
      BEFORE TRUNCATE ON audit_events
      FOR EACH STATEMENT EXECUTE FUNCTION audit_events_append_only();
  `);
}

export async function down({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    DROP TABLE IF EXISTS audit_chain_heads;
    DROP TABLE IF EXISTS audit_events;
    DROP FUNCTION IF EXISTS audit_events_append_only();
  `);
}
