import { randomBytes } from 'node:crypto';
import { hash } from '@node-rs/argon2';
import pg from 'pg';

/**
 * Test data written straight into the run's fresh database (the browser tests get no demo
 * seed): organizations, people and memberships, the way an operator would provision them.
 * Rows of organization-owned tables are behind row-level security, so each write runs in a
 * transaction whose `biasproof.org_id` scope is `*` (the system scope).
 */

/** The password of every fixture person: long enough and not on the common list. */
export const FIXTURE_PASSWORD = 'emitter-follower-7731';

export const uniqueSuffix = () => randomBytes(4).toString('hex');

export interface FixtureOrg {
  id: string;
  slug: string;
  name: string;
}

export interface FixturePerson {
  id: string;
  email: string;
  name: string;
  password: string;
}

type Role = 'admin' | 'author' | 'checker' | 'approver' | 'manager';

function databaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: run browser tests through `npm test`');
  return url;
}

async function inSystemScope<T>(fn: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: databaseUrl() });
  await client.connect();
  try {
    await client.query('BEGIN');
    await client.query("SELECT set_config('biasproof.org_id', '*', true)");
    const result = await fn(client);
    await client.query('COMMIT');
    return result;
  } catch (error) {
    await client.query('ROLLBACK');
    throw error;
  } finally {
    await client.end();
  }
}

export async function createOrganization(name: string): Promise<FixtureOrg> {
  const slug = `${name
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')}-${uniqueSuffix()}`;
  return inSystemScope(async (db) => {
    const { rows } = await db.query<{ id: string }>(
      'INSERT INTO organizations (slug, name, timezone) VALUES ($1, $2, $3) RETURNING id',
      [slug, name, 'Europe/Berlin'],
    );
    return { id: rows[0]!.id, slug, name };
  });
}

/** A person with an account (argon2id hash, as the server stores it) and no membership yet. */
export async function createPerson(name: string, domain: string): Promise<FixturePerson> {
  const email = `${name.split(' ')[0]!.toLowerCase()}.${uniqueSuffix()}@${domain}`;
  const passwordHash = await hash(FIXTURE_PASSWORD);
  return inSystemScope(async (db) => {
    const { rows } = await db.query<{ id: string }>(
      'INSERT INTO users (email, name, password_hash) VALUES ($1, $2, $3) RETURNING id',
      [email, name, passwordHash],
    );
    return { id: rows[0]!.id, email, name, password: FIXTURE_PASSWORD };
  });
}

export async function addMembership(
  org: FixtureOrg,
  person: FixturePerson,
  roles: Role[],
): Promise<void> {
  await inSystemScope((db) =>
    db.query('INSERT INTO memberships (org_id, user_id, roles) VALUES ($1, $2, $3)', [
      org.id,
      person.id,
      roles,
    ]),
  );
}
