import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startRedis, type RunningRedis } from '../../scripts/lib/redis';
import { freePort } from '../../scripts/lib/free-port';
import { connectCluster, type ClusterLinks } from '../../server/cluster/cluster-links';
import { createRedisAccessChanges } from '../../server/auth/redis-access-changes';
import type { AccessChange } from '../../server/auth/access-changes';

// Two "instances" (two sets of links in this process, each with its own Redis connections and name)
// on a real redis-server: invalidations and access changes cross, and after a Redis restart both
// resubscribe and tell their listeners that messages may have been lost.

const quiet = { warn: () => undefined, error: () => undefined, info: () => undefined };
let redis: RunningRedis;
let dir: string;
let a: ClusterLinks;
let b: ClusterLinks;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'beadloom-redis-'));
  redis = await startRedis({ port: await freePort(), dir });
  a = await connectCluster(redis.url, quiet);
  b = await connectCluster(redis.url, quiet);
});

afterAll(async () => {
  await a?.close();
  await b?.close();
  await redis?.stop();
  rmSync(dir, { recursive: true, force: true });
});

const next = <T>(subscribe: (resolve: (value: T) => void) => void) => new Promise<T>((resolve) => subscribe(resolve));

describe('links between instances through Redis', () => {
  it('an invalidation published on A runs A’s listeners at once and B’s when it arrives, never twice', async () => {
    const onA: (string | null)[] = [];
    a.invalidation.subscribe('membership', (key) => onA.push(key));
    await new Promise((resolve) => setTimeout(resolve, 0));
    const arrived = next<string | null>((resolve) => b.invalidation.subscribe('membership', resolve));
    await a.redis!.subscriber.ping(); // both subscriptions confirmed before publishing
    await b.redis!.subscriber.ping();
    a.invalidation.publish('membership', '3:9');
    expect(onA).toEqual(['3:9']);
    expect(await arrived).toBe('3:9');
    // B publishes; A gets it once (its own publication did not come back to it).
    const back = next<string | null>((resolve) => a.invalidation.subscribe('membership', resolve));
    b.invalidation.publish('membership', '4:1');
    expect(await back).toBe('4:1');
    expect(onA).toEqual(['3:9', '4:1']);
  });

  it('access changes cross; after a Redis restart each instance resyncs and lists keep working', async () => {
    const changesA = createRedisAccessChanges(a.redis!, () => undefined);
    const changesB = createRedisAccessChanges(b.redis!, () => undefined);
    await b.redis!.subscriber.ping();
    const onB = next<AccessChange>((resolve) => changesB.subscribe(resolve));
    changesA.publish({ kind: 'membership', projectId: 2, userId: 5 });
    expect(await onB).toEqual({ kind: 'membership', projectId: 2, userId: 5 });

    const resyncB = next<AccessChange>((resolve) => changesB.subscribe((c) => c.kind === 'resync' && resolve(c)));
    const droppedA = next<string | null>((resolve) => a.invalidation.subscribe('session', (key) => key === null && resolve(key)));
    await redis.restart();
    expect(await resyncB).toEqual({ kind: 'resync' });
    expect(await droppedA).toBeNull();
    // Subscriptions are active again: a change published after the restart arrives.
    const afterRestart = next<AccessChange>((resolve) => changesB.subscribe((c) => c.kind === 'account' && resolve(c)));
    changesA.publish({ kind: 'account', userId: 8 });
    expect(await afterRestart).toEqual({ kind: 'account', userId: 8 });
    changesA.close();
    changesB.close();
  });
});
