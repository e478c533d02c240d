import { memo } from 'react';
import { editorCommands } from '../commands';
import { isAvailable, run, type CommandGroup, type EditorContext } from '../commands/registry';
import { Kbd } from './kbd';
import { ariaKeyShortcut, shortcutLabel } from '../model/platform-keys';

const GROUPS: { group: CommandGroup; label: string; only?: string[] }[] = [
  { group: 'beads', label: 'Bead editing' },
  { group: 'history', label: 'History' },
  { group: 'view', label: 'View', only: ['toggle-hydrogens', 'toggle-atom-numbers', 'toggle-atom-colours', 'fit-view', 'zoom-in', 'zoom-out', 'show-shortcuts'] },
];

/** The toolbar: the same registered commands the keyboard runs, disabled where they would not apply. */
/** Which view toggles are on (aria-pressed), by command name. */
export type ToggleState = Partial<Record<string, boolean>>;

export const EditorToolbar = memo(function EditorToolbar({ ctx, toggles }: { ctx: EditorContext; toggles: ToggleState }) {
  return (
    <div role="toolbar" aria-label="Mapping tools" className="flex flex-wrap items-center gap-x-3 gap-y-2">
      {GROUPS.map(({ group, label, only }) => (
        <div key={group} role="group" aria-label={label} className="flex flex-wrap items-center gap-1 border-r border-paper-300 pr-3 last:border-r-0">
          {editorCommands
            .filter((c) => c.group === group && (!only || only.includes(c.name)))
            .filter((c) => !(ctx.readOnly && c.edits))
            .map((c) => {
              const pressed = toggles[c.name];
              return (
                <button
                  key={c.name}
                  type="button"
                  disabled={!isAvailable(c, ctx)}
                  aria-pressed={pressed}
                  aria-keyshortcuts={c.shortcut && ariaKeyShortcut(c.shortcut)}
                  title={c.shortcut ? `${c.label} (${shortcutLabel(c.shortcut)})` : c.label}
                  onClick={() => run(c, ctx)}
                  className="inline-flex items-center gap-2 rounded-md border border-transparent px-2 py-1 text-sm font-semibold text-ink-800 hover:border-ink-200 hover:bg-ink-50 disabled:cursor-not-allowed disabled:text-ink-300 aria-pressed:border-ink-300 aria-pressed:bg-ink-100"
                >
                  <span>{c.label}</span>
                  {/* The hint is for the eye: its name is in aria-keyshortcuts, not in the button's name. */}
                  {c.shortcut && <Kbd muted hidden>{shortcutLabel(c.shortcut)}</Kbd>}
                </button>
              );
            })}
        </div>
      ))}
    </div>
  );
});
