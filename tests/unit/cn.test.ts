import { describe, expect, it } from 'vitest';
import { cn } from '../../src/lib/cn';

describe('cn (clsx + tailwind-merge)', () => {
  it('skips falsy values and reads clsx objects and arrays', () => {
    expect(cn('a', false, null, undefined, ['b', { c: true, d: false }])).toBe('a b c');
  });

  it('lets a later class of the same kind win, so a caller can override a component default', () => {
    expect(cn('px-4 py-2 text-sm', 'px-2')).toBe('py-2 text-sm px-2');
    expect(cn('bg-ink-700 text-paper-50', 'bg-alert-50')).toBe('text-paper-50 bg-alert-50');
  });

  it('keeps a text colour beside a text size, and our shadow-card beside a shadow colour', () => {
    expect(cn('text-sm text-ink-700')).toBe('text-sm text-ink-700');
    expect(cn('shadow-card', 'shadow-ink-200')).toBe('shadow-card shadow-ink-200');
    expect(cn('shadow-card', 'shadow-none')).toBe('shadow-none');
  });
});
