import { describe, expect, it } from 'vitest';
import { parseWeight } from '../../../src/features/editor/model/weight';

describe('a typed shared-atom weight', () => {
  it('takes numbers strictly between 0 and 1 (a decimal comma too)', () => {
    expect(parseWeight('0.3')).toEqual({ weight: 0.3 });
    expect(parseWeight(' .25 ')).toEqual({ weight: 0.25 });
    expect(parseWeight('0,5')).toEqual({ weight: 0.5 });
  });

  it('refuses anything else with a reason instead of keeping the old value', () => {
    for (const text of ['1', '1.0', '0', '-0.2', 'abc', '', '0.5.1', '1e-1', '2']) {
      const parsed = parseWeight(text);
      expect('error' in parsed, text).toBe(true);
    }
    expect(parseWeight('1')).toEqual({ error: expect.stringMatching(/less than 1/) });
    expect(parseWeight('abc')).toEqual({ error: expect.stringMatching(/not a number/) });
  });
});
