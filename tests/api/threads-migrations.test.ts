import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase, type TestDatabase } from '../helpers/db';
import { migrationSource } from '../../migrations/index';

// The threads migrations undo cleanly and apply again.

let database: TestDatabase;
beforeAll(async () => {
  database = await createTestDatabase();
});
afterAll(() => database.drop());

const TABLES = ['threads', 'thread_comments', 'thread_beads', 'notifications', 'notification_preferences'];

describe('threads migrations', () => {
  it('go down and up again', async () => {
    const db = database.db;
    const has = async () => Promise.all(TABLES.map((t) => db.schema.hasTable(t)));
    expect(await has()).toEqual(TABLES.map(() => true));
    await db.migrate.down({ migrationSource, name: '20261203_022_threads_notifications' });
    await db.migrate.down({ migrationSource, name: '20261203_021_threads' });
    expect(await has()).toEqual(TABLES.map(() => false));
    await db.migrate.latest({ migrationSource });
    expect(await has()).toEqual(TABLES.map(() => true));
  });
});
