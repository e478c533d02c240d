/**
 * Text in the faces that the editor first shows when a bead appears (the inspector's monospaced atom
 * list, the table's tabular figures), laid out invisibly when the editor mounts. Chromium resolves a
 * system font face the first time text needs it, which costs 10–20 ms on Linux (a fontconfig
 * lookup); done here, that happens before the editor is ready rather than inside the first command.
 */
export function FontPrimer() {
  return (
    <div aria-hidden="true" className="invisible absolute h-0 overflow-hidden">
      <span className="font-mono text-xs">0123456789, </span>
      <span className="text-sm font-semibold tabular-nums">0123456789.−+</span>
      <span className="text-sm tabular-nums">0123456789.−+</span>
    </div>
  );
}
