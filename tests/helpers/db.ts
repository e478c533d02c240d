import { randomBytes } from 'node:crypto';
import knexFactory from 'knex';
import { createDb, migrateLatest, type Db } from '../../server/db/knex';

// Each test file gets its own database in the throwaway MariaDB that
// `npm test` started (TEST_DATABASE_URL), so files run in parallel safely.

export interface TestDatabase {
  url: string;
  db: Db;
  drop(): Promise<void>;
}

function serverUrl(): URL {
  const raw = process.env.TEST_DATABASE_URL;
  if (!raw) throw new Error('TEST_DATABASE_URL is not set: run the tests with `npm test`, which starts MariaDB.');
  return new URL(raw);
}

export async function createTestDatabase(): Promise<TestDatabase> {
  const base = serverUrl();
  const name = `t_${process.pid}_${randomBytes(4).toString('hex')}`;
  const admin = knexFactory({ client: 'mysql2', connection: { uri: `${base.protocol}//${base.username}:${base.password}@${base.host}/${base.search}` } as never });
  await admin.raw(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.destroy();
  const url = `${base.protocol}//${base.username}:${base.password}@${base.host}/${name}${base.search}`;
  const db = createDb(url);
  await migrateLatest(db);
  return {
    url,
    db,
    async drop() {
      await db.raw(`DROP DATABASE \`${name}\``);
      await db.destroy();
    },
  };
}
