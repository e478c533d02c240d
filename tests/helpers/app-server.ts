import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startServer } from '../../server/index';
import { configFromEnv } from '../../server/config';
import { seedDemo } from '../../seeds/demo';
import { createTestDatabase } from './db';

// The whole app as `npm start` runs it (HTTP server, SMTP sink, built client
// from dist/) on a fresh demo-seeded database and a free port, for browser tests.

/** `env` adds settings as the environment would give them (e.g. LOGIN_BACKOFF_BASE_MS, CHEM_JOB_TIMEOUT_MS). */
export async function startTestServer(env: Record<string, string> = {}): Promise<{ url: string; stop(): Promise<void> }> {
  const database = await createTestDatabase();
  await seedDemo(database.db, 12);
  // Uploaded references go to a folder of this run's own.
  const dataDir = mkdtempSync(join(tmpdir(), 'beadloom-e2e-data-'));
  const config = configFromEnv({
    BEADLOOM_DATA_DIR: dataDir,
    DATABASE_URL: database.url,
    SESSION_SECRET: 'browser-test-secret-that-is-long-enough-0123',
    PORT: '0',
    LOG_LEVEL: 'silent',
    CLIENT_DIR: 'dist',
    ...env,
  });
  const running = await startServer(config);
  // Links in e-mails must point at the port actually bound.
  running.ctx.config.appUrl = running.url;
  return {
    url: running.url,
    async stop() {
      await running.stop();
      await database.drop();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
