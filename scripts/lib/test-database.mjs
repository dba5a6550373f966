// A fresh database for one test run, created by the app role and dropped afterwards.
import pg from 'pg';

const port = Number(process.env.PGPORT ?? 54329);
const adminUrl = `postgres://biasproof:${process.env.BIASPROOF_DB_PASSWORD ?? 'biasproof-local'}@127.0.0.1:${port}/postgres`;

export async function createTestDatabase() {
  const name = `biasproof_test_${Date.now().toString(36)}_${process.pid}`;
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`CREATE DATABASE "${name}"`);
  } finally {
    await client.end();
  }
  return { name, url: adminUrl.replace(/\/postgres$/, `/${name}`) };
}

export async function dropTestDatabase(name) {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  } finally {
    await client.end();
  }
}
