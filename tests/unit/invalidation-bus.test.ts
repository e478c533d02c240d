import { describe, expect, it } from 'vitest';
import { createInProcessInvalidationBus } from '../../server/cluster/invalidation-bus';

describe('the in-process invalidation bus', () => {
  it('calls the topic’s listeners before publish returns, and no others; a throwing listener stops none', () => {
    const errors: unknown[] = [];
    const bus = createInProcessInvalidationBus((err) => errors.push(err));
    const seen: (string | null)[] = [];
    bus.subscribe('membership', () => {
      throw new Error('boom');
    });
    const stop = bus.subscribe('membership', (key) => seen.push(key));
    bus.subscribe('session', () => seen.push('wrong topic'));
    bus.publish('membership', '12:7');
    expect(seen).toEqual(['12:7']);
    expect(errors).toHaveLength(1);
    stop();
    bus.publish('membership', '12:8');
    expect(seen).toEqual(['12:7']);
  });
});
