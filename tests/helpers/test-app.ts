import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createApp, type BuiltApp } from '../../server/app';
import { configFromEnv, type Config } from '../../server/config';
import { createLogger } from '../../server/logger';
import { createMailer } from '../../server/mail/mailer';
import { startMailSink, type CaughtMessage } from '../../server/mail/sink';
import type { AppContext } from '../../server/context';
import { seedDemo } from '../../seeds/demo';
import { createLocalAccessChanges } from '../../server/auth/access-changes';
import { createInProcessInvalidationBus } from '../../server/cluster/invalidation-bus';
import { createTestDatabase, type TestDatabase } from './db';
import type { CollabOptions } from '../../server/drafts/room-options';

// The real Express app on a fresh, migrated and demo-seeded database, with the
// real local SMTP sink. Tests drive it with supertest (see client.ts).

export interface TestApp extends BuiltApp {
  ctx: AppContext;
  database: TestDatabase;
  /** Messages the SMTP sink caught, newest first. */
  mail(): Promise<CaughtMessage[]>;
  /**
   * The next message the sink stores that `match` accepts. Call it before the request that sends the
   * mail (mail goes out after the answer), then await it: the test waits for the sink's event.
   */
  nextMail(match: (message: CaughtMessage) => boolean): Promise<CaughtMessage>;
  stop(): Promise<void>;
}

export async function createTestApp(overrides: Partial<Config> = {}, collabOptions: Partial<CollabOptions> = {}): Promise<TestApp> {
  const database = await createTestDatabase();
  await seedDemo(database.db, 12);
  const sink = await startMailSink(database.db);
  const dataDir = mkdtempSync(join(tmpdir(), 'beadloom-data-'));
  const config: Config = {
    ...configFromEnv({ DATABASE_URL: database.url, SESSION_SECRET: 'test-secret-that-is-long-enough-0123456789', PORT: '4820' }),
    clientDir: null,
    dataDir,
    logLevel: 'silent',
    ...overrides,
  };
  const mailer = createMailer(sink.url, config.mailFrom);
  const ctx: AppContext = { config, db: database.db, log: createLogger('silent'), mailer, mailSinkInUse: true, accessChanges: createLocalAccessChanges(), invalidation: createInProcessInvalidationBus(), redis: null };
  const built = createApp(ctx, collabOptions);
  return {
    ...built,
    ctx,
    database,
    async mail() {
      const rows = await database.db('dev_mail').orderBy('id', 'desc');
      return rows.map((r) => ({ to: r.to_addresses, subject: r.subject, text: r.text_body, html: r.html_body }));
    },
    nextMail(match) {
      return new Promise((resolve) => {
        const stop = sink.onMessage((message) => {
          if (!match(message)) return;
          stop();
          resolve(message);
        });
      });
    },
    async stop() {
      await built.close();
      mailer.close();
      await sink.close();
      await database.drop();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
