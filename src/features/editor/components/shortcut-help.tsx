import { useEffect, useId, useRef } from 'react';
import { createPortal } from 'react-dom';
import { editorCommands } from '../commands';
import type { CommandGroup } from '../commands/registry';
import { Kbd } from './kbd';
import { shortcutLabel } from '../model/platform-keys';

const TITLES: Record<CommandGroup, string> = { beads: 'Beads', selection: 'Selecting', history: 'History', view: 'View' };

const CANVAS_KEYS: [string, string][] = [
  ['Click', 'Select an atom (or a bead, on its hull)'],
  ['Shift Click', 'Add or remove an atom'],
  ['Drag', 'Select atoms in a box (Shift adds)'],
  ['Alt Drag', 'Pan the drawing'],
  ['Wheel', 'Zoom about the pointer'],
  ['Arrows', 'Move the atom cursor along bonds'],
  ['Space', 'Select the atom under the cursor'],
];

/** The `?` overlay: every shortcut, read from the same command list the toolbar uses. */
export function ShortcutHelp({ onClose }: { onClose: () => void }) {
  const titleId = useId();
  const close = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    const previous = document.activeElement as HTMLElement | null;
    close.current?.focus();
    return () => previous?.focus();
  }, []);
  const groups = (Object.keys(TITLES) as CommandGroup[]).map((g) => ({ g, commands: editorCommands.filter((c) => c.group === g && c.shortcut) }));

  // Portalled to <body>: the editor's full-width wrapper is transformed, which would trap `fixed`.
  return createPortal(
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-ink-950/30 p-4" onMouseDown={(e) => e.target === e.currentTarget && onClose()}>
      <div
        role="dialog"
        aria-modal="true"
        aria-labelledby={titleId}
        onKeyDown={(e) => {
          e.stopPropagation();
          if (e.key === 'Escape' || e.key === '?') onClose();
        }}
        className="max-h-[85vh] w-full max-w-3xl overflow-auto rounded-lg border border-paper-300 bg-paper-50 p-6 shadow-card"
      >
        <div className="mb-4 flex items-center justify-between">
          <h2 id={titleId} className="text-lg font-bold text-ink-900">Keyboard shortcuts</h2>
          <button ref={close} type="button" onClick={onClose} className="inline-flex items-center gap-2 rounded-md px-2 py-1 text-sm font-semibold text-ink-700 hover:bg-ink-50">
            <span>Close</span> <Kbd muted hidden>Esc</Kbd>
          </button>
        </div>
        <div className="grid gap-6 sm:grid-cols-2">
          {groups.map(({ g, commands }) => (
            <ShortcutList key={g} title={TITLES[g]} rows={commands.map((c) => [c.shortcut!, c.label])} />
          ))}
          <ShortcutList title="On the drawing" rows={CANVAS_KEYS} />
        </div>
      </div>
    </div>,
    document.body,
  );
}

function ShortcutList({ title, rows }: { title: string; rows: [string, string][] }) {
  return (
    <section>
      <h3 className="mb-2 text-sm font-bold text-ink-700">{title}</h3>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-sm">
        {rows.map(([keys, label]) => (
          <div key={label} className="contents">
            <dt className="flex gap-1">{shortcutLabel(keys).split(' ').map((k) => <Kbd key={k}>{k}</Kbd>)}</dt>
            <dd className="text-ink-800">{label}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}
