import type { MigrationContext } from '../migrator.ts';

// Organizations (tenants), people, their memberships, invitations and password resets.
// E-mail addresses are unique regardless of case (a unique index on lower(email)); tokens are
// stored only as SHA-256 hashes, so a database leak does not hand out working links.
export async function up({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    CREATE TABLE organizations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      slug text NOT NULL UNIQUE CHECK (slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$' AND length(slug) <= 60),
      name text NOT NULL CHECK (length(trim(name)) > 0),
      timezone text NOT NULL DEFAULT 'UTC',
      settings jsonb NOT NULL DEFAULT '{}'::jsonb,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE users (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      email text NOT NULL CHECK (email = lower(email) AND position('@' in email) > 1),
      name text NOT NULL CHECK (length(trim(name)) > 0),
      password_hash text NOT NULL,
      disabled boolean NOT NULL DEFAULT false,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE UNIQUE INDEX users_email_lower_key ON users (lower(email));

    CREATE TABLE memberships (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      org_id uuid NOT NULL REFERENCES organizations (id) ON DELETE CASCADE,
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      roles text[] NOT NULL CHECK (
        cardinality(roles) >= 1 AND roles <@ ARRAY['admin', 'author', 'checker', 'approver', 'manager']::text[]
      ),
      disabled boolean NOT NULL DEFAULT false,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (org_id, user_id)
    );
    CREATE INDEX memberships_user_id_idx ON memberships (user_id);

    CREATE TABLE invitations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      org_id uuid NOT NULL REFERENCES organizations (id) ON DELETE CASCADE,
      email text NOT NULL CHECK (email = lower(email)),
      roles text[] NOT NULL CHECK (
        cardinality(roles) >= 1 AND roles <@ ARRAY['admin', 'author', 'checker', 'approver', 'manager']::text[]
      ),
      token_hash text NOT NULL UNIQUE,
      invited_by_user_id uuid NOT NULL REFERENCES users (id),
      expires_at timestamptz NOT NULL,
      accepted_at timestamptz,
      accepted_by_user_id uuid REFERENCES users (id),
      revoked_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX invitations_org_id_idx ON invitations (org_id, created_at);

    CREATE TABLE password_resets (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      token_hash text NOT NULL UNIQUE,
      expires_at timestamptz NOT NULL,
      used_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX password_resets_user_id_idx ON password_resets (user_id);

    -- Ending every session of one person (password reset) looks sessions up by their user.
    CREATE INDEX session_user_id_idx ON "session" ((sess ->> 'userId'));
  `);
}

export async function down({ sequelize }: MigrationContext): Promise<void> {
  await sequelize.query(`
    DROP INDEX IF EXISTS session_user_id_idx;
    DROP TABLE IF EXISTS password_resets;
    DROP TABLE IF EXISTS invitations;
    DROP TABLE IF EXISTS memberships;
    DROP TABLE IF EXISTS users;
    DROP TABLE IF EXISTS organizations;
  `);
}
