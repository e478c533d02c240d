import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { createTestDatabase, type TestDatabase } from '../helpers/db';
import { seedDemo } from '../../seeds/demo';
import { connectClient, sessionCookie, synced, until, type CollabClient } from '../helpers/collab-client';
import { demoMappingId } from '../helpers/fixtures';
import { beadsOf, createBead, docToMapping } from '../../src/shared/mapping-doc';

// SIGKILL the server mid-session: every update it accepted (and so relayed) must be there after a restart.

let database: TestDatabase;
let child: ChildProcess | null = null;
let port = 0;
const clients: CollabClient[] = [];

async function startChild(): Promise<string> {
  child = spawn(process.execPath, ['--import', 'tsx', 'tests/helpers/server-child.ts'], {
    env: { ...process.env, DATABASE_URL: database.url, SESSION_SECRET: 'restart-test-secret-that-is-long-enough-0123', PORT: String(port), LOG_LEVEL: 'silent', CLIENT_DIR: '' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  let out = '';
  for await (const chunk of child.stdout!) {
    out += chunk;
    const m = /READY (\S+)/.exec(out);
    if (m) {
      port = Number(new URL(m[1]).port);
      return m[1].replace('localhost', '127.0.0.1');
    }
  }
  throw new Error(`server child exited: ${out}`);
}

beforeAll(async () => {
  database = await createTestDatabase();
  await seedDemo(database.db, 12);
});
afterAll(async () => {
  for (const c of clients) c.destroy();
  if (child && child.exitCode === null) {
    child.kill('SIGTERM');
    await once(child, 'exit');
  }
  await database.drop();
});

describe('a server killed with SIGKILL', () => {
  it('loses no accepted update', { timeout: 120_000 }, async () => {
    let url = await startChild();
    const mappingId = await demoMappingId(database.db);
    const cookie = await sessionCookie(url, 'modeller@example.org');
    const writer = connectClient(url, mappingId, cookie);
    const watcher = connectClient(url, mappingId, await sessionCookie(url, 'supervisor@example.org'));
    clients.push(writer, watcher);
    await Promise.all([synced(writer), synced(watcher)]);
    const ids: string[] = [];
    for (let i = 0; i < 7; i++) ids.push(createBead(writer.doc, [18 + i], { id: `kept-${i}` }));
    // The watcher seeing an edit means the server stored it first (persist, then relay).
    await until('watcher has every edit', () => ids.every((id) => beadsOf(watcher.doc).has(id)));
    const expected = docToMapping(watcher.doc);

    writer.provider.disconnect();
    watcher.provider.disconnect();
    child!.kill('SIGKILL');
    await once(child!, 'exit');

    url = await startChild();
    const fresh = connectClient(url, mappingId, cookie);
    clients.push(fresh);
    await synced(fresh);
    expect(docToMapping(fresh.doc)).toEqual(expected);
    const res = await fetch(`${url}/api/mappings/${mappingId}`, { headers: { cookie } });
    expect((await res.json()).draft).toEqual(expected);
  });
});
