import { describe, expect, it } from 'vitest';
import { DebounceWindow } from '../../server/drafts/debounce-window';

// The room's evaluation timing (server/drafts/draft-evaluator.ts): 40 ms after the last change, at most
// 100 ms after the first one not yet evaluated. Driven by a hand-set clock, so no test waits.

function windowAt(delayMs = 40, maxWaitMs = 100) {
  let t = 1_000;
  const w = new DebounceWindow(delayMs, maxWaitMs, () => t);
  return { w, at: (ms: number) => void (t = 1_000 + ms) };
}

describe('DebounceWindow', () => {
  it('is due the delay after a single change', () => {
    const { w, at } = windowAt();
    w.note();
    expect(w.untilDue()).toBe(40);
    at(25);
    expect(w.untilDue()).toBe(15);
    at(40);
    expect(w.untilDue()).toBe(0);
  });

  it('moves with each further change', () => {
    const { w, at } = windowAt();
    w.note();
    at(30);
    w.note();
    expect(w.untilDue()).toBe(40);
  });

  it('is due at the bound during a burst of changes 10 ms apart', () => {
    const { w, at } = windowAt();
    let dueAt: number | null = null;
    for (let ms = 0; ms <= 300 && dueAt === null; ms += 10) {
      at(ms);
      if (ms > 0 && w.untilDue() === 0) dueAt = ms;
      else w.note();
    }
    expect(dueAt).toBe(100);
  });

  it('counts the bound from the first change after the work was taken up', () => {
    const { w, at } = windowAt();
    w.note();
    at(100);
    w.take();
    expect(w.untilDue()).toBe(0); // nothing waits
    at(150);
    w.note();
    at(240);
    w.note();
    expect(w.untilDue()).toBe(10); // 150 + 100 − 240, sooner than 240 + 40
  });
});
