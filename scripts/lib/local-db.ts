import { startMariaDb, type RunningMariaDb } from './mariadb';
import { persistentSecret } from './secrets';
import { createDb, migrateLatest } from '../../server/db/knex';
import { seedDemo } from '../../seeds/demo';
import { seedDemoReference } from '../../seeds/demo-reference';

/**
 * The private MariaDB of `npm start` and `npm run dev`: data in .data/mariadb,
 * port DB_PORT (4830), migrated, and seeded with the demo when empty (unless told not to).
 */
export async function startLocalDatabase(seed: boolean): Promise<{ mariadb: RunningMariaDb; seeded: boolean }> {
  const mariadb = await startMariaDb({
    dataDir: '.data/mariadb',
    port: Number(process.env.DB_PORT ?? 4830),
    database: 'beadloom',
    user: 'beadloom',
    password: persistentSecret('.data/db-password'),
  });
  try {
    const db = createDb(mariadb.url);
    await migrateLatest(db);
    const seeded = seed && (await seedDemo(db, 12));
    // The demo reference and its analysis (files under the data folder, like an upload's).
    if (seeded) await seedDemoReference(db, process.env.BEADLOOM_DATA_DIR || '.data/files');
    await db.destroy();
    return { mariadb, seeded };
  } catch (err) {
    await mariadb.stop();
    throw err;
  }
}

/** An external MariaDB (DATABASE_URL): migrated, and seeded with the demo when empty and asked to. */
export async function prepareExternalDatabase(url: string, seed: boolean): Promise<boolean> {
  const db = createDb(url);
  try {
    await migrateLatest(db);
    const seeded = seed && (await seedDemo(db, 12));
    if (seeded) await seedDemoReference(db, process.env.BEADLOOM_DATA_DIR || '.data/files');
    return seeded;
  } finally {
    await db.destroy();
  }
}

export const sessionSecret = () => process.env.SESSION_SECRET ?? persistentSecret('.data/session-secret', 48);
