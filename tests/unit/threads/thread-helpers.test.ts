import { describe, expect, it } from 'vitest';
import { createThreadBody, openThreadCounts, threadLink, type Thread } from '../../../src/shared/threads';
import { markReadBody } from '../../../src/shared/notifications';

const thread = (id: number, beadId: string, resolved: boolean) => ({ id, beadId, resolved }) as Thread;

describe('thread helpers', () => {
  it('counts open threads per bead for the badges', () => {
    const counts = openThreadCounts([thread(1, 'b1', false), thread(2, 'b1', false), thread(3, 'b1', true), thread(4, 'b2', true)]);
    expect([...counts]).toEqual([['b1', 2]]);
  });

  it('builds the deep link, escaping the bead id', () => {
    expect(threadLink('http://host:4820/', 3, 'b1', 7)).toBe('http://host:4820/mappings/3?bead=b1&thread=7');
    expect(threadLink('http://h', 3, 'a b&c', 7)).toBe('http://h/mappings/3?bead=a+b%26c&thread=7');
  });

  it('refuses bead ids that are not ids, and mark-read bodies that name nothing', () => {
    expect(createThreadBody.safeParse({ beadId: 'b01ab', body: 'x' }).success).toBe(true);
    expect(createThreadBody.safeParse({ beadId: 'b1"><x', body: 'x' }).success).toBe(false);
    expect(createThreadBody.safeParse({ beadId: 'b1', body: 'x', extra: 1 }).success).toBe(false);
    expect(markReadBody.safeParse({ ids: [] }).success).toBe(false);
    expect(markReadBody.safeParse({ all: true }).success).toBe(true);
  });
});
