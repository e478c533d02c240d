/**
 * Shortcut names for the platform the editor runs on. Commands name their keys once, portably
 * ("Ctrl Z"); keyTest accepts Ctrl or ⌘ either way (commands/registry.ts). On macOS the Command key
 * is what people press, so there the names say ⌘ (and ⌥ for Alt, ⇧ for Shift, as macOS menus do).
 */
export function isApplePlatform(nav: { platform?: string; userAgent?: string } | undefined = globalThis.navigator): boolean {
  const data = (nav as { userAgentData?: { platform?: string } } | undefined)?.userAgentData?.platform;
  return /mac|iphone|ipad/i.test(data || nav?.platform || nav?.userAgent || '');
}

const APPLE: Record<string, string> = { Ctrl: '⌘', Alt: '⌥', Shift: '⇧' };

/** "Ctrl Shift Z" → "⌘ ⇧ Z" on macOS, unchanged elsewhere (keys stay space-separated). */
export function shortcutLabel(shortcut: string, apple = isApplePlatform()): string {
  return apple ? shortcut.split(' ').map((k) => APPLE[k] ?? k).join(' ') : shortcut;
}

const ARIA: Record<string, string> = { Del: 'Delete', Esc: 'Escape', '−': '-' };

/** The aria-keyshortcuts value (WAI-ARIA key names joined by "+"), e.g. "Control+Z" or "Meta+Z". */
export function ariaKeyShortcut(shortcut: string, apple = isApplePlatform()): string {
  return shortcut.split(' ').map((k) => (k === 'Ctrl' ? (apple ? 'Meta' : 'Control') : (ARIA[k] ?? k))).join('+');
}
