import knexFactory, { type Knex } from 'knex';
import { migrationSource } from '../../migrations';

export type Db = Knex;

/** mysql2's settings for the app's connections (the pool's, and the update log's own connection). */
export const connectionOptions = (databaseUrl: string) => ({ uri: databaseUrl, dateStrings: false, timezone: 'Z', charset: 'utf8mb4', supportBigNumbers: true });

export function createDb(databaseUrl: string): Knex {
  return knexFactory({
    client: 'mysql2',
    connection: connectionOptions(databaseUrl) as Knex.MySql2ConnectionConfig & { uri: string },
    pool: { min: 0, max: 10 },
  });
}

/** Migrations are listed in migrations/index.ts so they load the same way under tsx and vitest. */
export async function migrateLatest(db: Knex): Promise<void> {
  await db.migrate.latest({ migrationSource });
}

export async function dbIsUp(db: Knex): Promise<boolean> {
  try {
    await db.raw('SELECT 1');
    return true;
  } catch {
    return false;
  }
}
