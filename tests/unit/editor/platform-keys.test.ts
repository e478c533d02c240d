import { describe, expect, it } from 'vitest';
import { ariaKeyShortcut, isApplePlatform, shortcutLabel } from '../../../src/features/editor/model/platform-keys';

describe('platform-aware shortcut names', () => {
  it('says ⌘ on macOS and Ctrl elsewhere', () => {
    expect(isApplePlatform({ platform: 'MacIntel' })).toBe(true);
    expect(isApplePlatform({ platform: 'Linux x86_64' })).toBe(false);
    expect(isApplePlatform({ platform: 'Win32' })).toBe(false);
    expect(shortcutLabel('Ctrl Shift Z', true)).toBe('⌘ ⇧ Z');
    expect(shortcutLabel('Ctrl Shift Z', false)).toBe('Ctrl Shift Z');
    expect(shortcutLabel('Alt Drag', true)).toBe('⌥ Drag');
  });

  it('names keys as WAI-ARIA aria-keyshortcuts does', () => {
    expect(ariaKeyShortcut('Ctrl Z', false)).toBe('Control+Z');
    expect(ariaKeyShortcut('Ctrl Shift Z', true)).toBe('Meta+Shift+Z');
    expect(ariaKeyShortcut('Del', false)).toBe('Delete');
    expect(ariaKeyShortcut('Esc', false)).toBe('Escape');
  });
});
