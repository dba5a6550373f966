import type { MigrationContext } from '../migrator.ts';

// Revision history: each revision keeps its own workflow state, and replies in a finding's
// thread that move nothing.
//
// revisions.state: the current revision always shares its worksheet's state; a trigger on
// worksheets copies it whenever the state or the current letter changes, so no code path can
// let the two drift. An earlier revision keeps where it ended: `returned` (a return started the
// next letter), `signed_off`, or `superseded` once a later revision is signed (the sign step
// sets that). revisions.submitted_at: when the revision was first submitted, i.e. frozen.
//
// The frozen guard of migration 06 refused every UPDATE of a frozen revision; it now lets a
// change of `state` alone through, and still refuses any change of content and any DELETE.
const states = `('draft', 'in_check', 'checked', 'signed_off', 'returned', 'withdrawn', 'superseded')`;

export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    ALTER TABLE finding_replies DROP CONSTRAINT finding_replies_kind_check;
    ALTER TABLE finding_replies ADD CONSTRAINT finding_replies_kind_check
      CHECK (kind IN ('answer', 'close', 'reopen', 'reply'));

    ALTER TABLE revisions ADD COLUMN state text NOT NULL DEFAULT 'draft' CHECK (state IN ${states});
    ALTER TABLE revisions ADD COLUMN submitted_at timestamptz;

    CREATE OR REPLACE FUNCTION biasproof_frozen_revision_guard() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP = 'UPDATE' AND (to_jsonb(NEW) - 'state') = (to_jsonb(OLD) - 'state') THEN
        RETURN NEW;
      END IF;
      RAISE EXCEPTION 'revision % of worksheet % is frozen', OLD.letter, OLD.worksheet_id
        USING ERRCODE = 'check_violation';
    END $$;

    -- A new revision starts in its worksheet's state when it is already the current letter
    -- (a new worksheet's A); a next letter gets its state when the worksheet makes it current.
    CREATE FUNCTION biasproof_revision_initial_state() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      NEW.state := coalesce(
        (SELECT w.state FROM worksheets w
          WHERE w.id = NEW.worksheet_id AND w.current_revision = NEW.letter),
        NEW.state);
      RETURN NEW;
    END $$;
    CREATE TRIGGER revisions_initial_state BEFORE INSERT ON revisions
      FOR EACH ROW EXECUTE FUNCTION biasproof_revision_initial_state();

    CREATE FUNCTION biasproof_revision_state_follows_worksheet() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      UPDATE revisions SET state = NEW.state
       WHERE org_id = NEW.org_id AND worksheet_id = NEW.id AND letter = NEW.current_revision
         AND state IS DISTINCT FROM NEW.state;
      RETURN NULL;
    END $$;
    CREATE TRIGGER worksheets_revision_state AFTER UPDATE OF state, current_revision ON worksheets
      FOR EACH ROW EXECUTE FUNCTION biasproof_revision_state_follows_worksheet();
  `);
  // The backfill reads every organization's rows and writes submitted_at into frozen
  // revisions, so it runs in the system scope with the frozen guard off for this one statement.
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `SELECT set_config('biasproof.org_id', '*', true);
       ALTER TABLE revisions DISABLE TRIGGER revisions_frozen_guard;
       UPDATE revisions r SET
         state = CASE
           WHEN r.letter = w.current_revision THEN w.state
           -- Earlier letters: signed ones by their signature, the others ended in a return
           -- (the only way a next letter was started before this migration).
           WHEN EXISTS (SELECT 1 FROM signatures s WHERE s.worksheet_id = r.worksheet_id
                         AND s.revision_letter = r.letter AND s.superseded_at IS NULL) THEN 'signed_off'
           WHEN EXISTS (SELECT 1 FROM signatures s WHERE s.worksheet_id = r.worksheet_id
                         AND s.revision_letter = r.letter) THEN 'superseded'
           ELSE 'returned' END,
         submitted_at = CASE WHEN r.frozen THEN coalesce(
           (SELECT min(e.at) FROM audit_events e
             WHERE e.org_id = r.org_id AND e.action = 'worksheet.submitted'
               AND e.target_id = r.worksheet_id::text AND e.details->>'revision' = r.letter),
           r.updated_at) END
         FROM worksheets w WHERE w.id = r.worksheet_id;
       ALTER TABLE revisions ENABLE TRIGGER revisions_frozen_guard;`,
      { transaction },
    );
  });
}

export async function down({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    DROP TRIGGER IF EXISTS worksheets_revision_state ON worksheets;
    DROP FUNCTION IF EXISTS biasproof_revision_state_follows_worksheet();
    DROP TRIGGER IF EXISTS revisions_initial_state ON revisions;
    DROP FUNCTION IF EXISTS biasproof_revision_initial_state();
    CREATE OR REPLACE FUNCTION biasproof_frozen_revision_guard() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'revision % of worksheet % is frozen', OLD.letter, OLD.worksheet_id
        USING ERRCODE = 'check_violation';
    END $$;
    ALTER TABLE revisions DROP COLUMN IF EXISTS submitted_at;
    ALTER TABLE revisions DROP COLUMN IF EXISTS state;
  `);
  // Replies have no place in the older thread; they go before the old check comes back.
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(
      `SELECT set_config('biasproof.org_id', '*', true);
       DELETE FROM finding_replies WHERE kind = 'reply';
       ALTER TABLE finding_replies DROP CONSTRAINT finding_replies_kind_check;
       ALTER TABLE finding_replies ADD CONSTRAINT finding_replies_kind_check
         CHECK (kind IN ('answer', 'close', 'reopen'));`,
      { transaction },
    );
  });
}
