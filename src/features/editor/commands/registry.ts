import type * as Y from 'yjs';
import type { MappingView } from '../model/bead-view';
import type { Selection } from '../model/selection';

/**
 * Editor commands as registered objects: the toolbar, the keyboard and the help overlay all read
 * the same list, so a shortcut and its button can never do different things.
 */
export interface EditorContext {
  doc: Y.Doc;
  /** The origin every local edit carries; the undo manager tracks only this one. */
  origin: unknown;
  undo: Y.UndoManager;
  readOnly: boolean;
  view: MappingView;
  atomCount: number;
  /** Atoms that are free ions (charged, bonded to nothing): each belongs in a bead of its own. */
  freeIons?: readonly number[];
  selection: Selection;
  setSelection(next: Selection): void;
  activeBead: string | null;
  setActiveBead(id: string | null): void;
  /** Suggested bead type per bead id, from the latest evaluation. */
  suggestions: ReadonlyMap<string, string | null>;
  ui: EditorUi;
}

export interface EditorUi {
  toggleHydrogens(): void;
  toggleAtomNumbers(): void;
  toggleAtomColours(): void;
  fit(): void;
  zoom(factor: number): void;
  openHelp(): void;
  startRename(beadId: string): void;
  /** Asks for a proposal (the proposal panel's scope). */
  propose(): void;
}

export interface KeyLike {
  key: string;
  shiftKey: boolean;
  ctrlKey: boolean;
  metaKey: boolean;
  altKey: boolean;
}

export type CommandGroup = 'beads' | 'selection' | 'history' | 'view';

export interface EditorCommand {
  name: string;
  label: string;
  group: CommandGroup;
  /** How the shortcut reads in the toolbar and the help overlay, e.g. "B" or "Ctrl Z". */
  shortcut?: string;
  keyTest?: (event: KeyLike) => boolean;
  /** Changes the draft: unavailable when read-only. */
  edits: boolean;
  enabled?: (ctx: EditorContext) => boolean;
  perform: (ctx: EditorContext) => void;
}

export function isAvailable(command: EditorCommand, ctx: EditorContext): boolean {
  if (command.edits && ctx.readOnly) return false;
  return command.enabled ? command.enabled(ctx) : true;
}

/** Runs the command if it is available; reports whether it ran. */
export function run(command: EditorCommand, ctx: EditorContext): boolean {
  if (!isAvailable(command, ctx)) return false;
  command.perform(ctx);
  return true;
}

/** The command a key press means, if any (available or not: callers decide what to say). */
export function commandForKey(commands: readonly EditorCommand[], event: KeyLike): EditorCommand | undefined {
  return commands.find((c) => c.keyTest?.(event));
}

/** A plain key with no modifier (shift allowed only where the key itself needs it, like "?"). */
export const plainKey = (...keys: string[]) => (e: KeyLike) =>
  !e.ctrlKey && !e.metaKey && !e.altKey && keys.includes(e.key.length === 1 ? e.key.toLowerCase() : e.key);

/** Ctrl (or ⌘ on a Mac) with a key; `shift` says whether Shift must be down. */
export const modKey = (key: string, shift = false) => (e: KeyLike) =>
  (e.ctrlKey || e.metaKey) && !e.altKey && e.shiftKey === shift && e.key.toLowerCase() === key;
