import { Worker } from 'node:worker_threads';
import { getPriority } from 'node:os';
import { describe, expect, it } from 'vitest';

// lowerThreadPriority (server/workers/background-priority.ts) must lower only the worker thread that
// calls it (Linux: nice values are per thread), never the process's main thread.

describe('lowerThreadPriority', () => {
  it.runIf(process.platform === 'linux')('sets nice 19 on the calling thread only', async () => {
    const mainBefore = getPriority(process.pid);
    const moduleUrl = new URL('../../server/workers/background-priority.ts', import.meta.url).href;
    const boot = `
      const { parentPort } = require('node:worker_threads');
      const { readlinkSync } = require('node:fs');
      const { getPriority } = require('node:os');
      import('tsx/esm/api').then((m) => { m.register(); return import(${JSON.stringify(moduleUrl)}); }).then((mod) => {
        const tid = Number(readlinkSync('/proc/thread-self').split('/').pop());
        const before = getPriority(tid);
        mod.lowerThreadPriority();
        parentPort.postMessage({ before, after: getPriority(tid) });
      });`;
    const worker = new Worker(boot, { eval: true });
    const seen = await new Promise<{ before: number; after: number }>((resolve, reject) => {
      worker.once('message', resolve);
      worker.once('error', reject);
    });
    await worker.terminate();
    expect(seen.before).toBe(mainBefore);
    expect(seen.after).toBe(19);
    expect(getPriority(process.pid)).toBe(mainBefore);
  });
});
