/**
 * Performance marks the browser benchmark reads (bench/editor-browser.ts):
 *   beadloom:editor-ready      the live draft is synced and its first frame painted (time since navigation)
 *   beadloom:command-to-paint  a keyboard command until the frame that shows its result
 * "Painted" is approximated as the first task after the next animation frame.
 */
export function afterPaint(fn: () => void): void {
  requestAnimationFrame(() => setTimeout(fn, 0));
}

let ready = false;

export function markEditorReady(): void {
  if (ready) return;
  ready = true;
  afterPaint(() => performance.mark('beadloom:editor-ready'));
}

export function measureCommand(name: string): void {
  const start = `beadloom:command:${name}`;
  performance.mark(start);
  afterPaint(() => performance.measure('beadloom:command-to-paint', { start, detail: { command: name } }));
}
