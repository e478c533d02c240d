import * as Y from 'yjs';
import type { Bond } from '../../../src/shared/chem';
import { editorCommands } from '../../../src/features/editor/commands';
import type { EditorContext } from '../../../src/features/editor/commands/registry';
import { mappingView } from '../../../src/features/editor/model/bead-view';
import { EMPTY, type Selection } from '../../../src/features/editor/model/selection';

/** A real Yjs document and undo manager behind a command context, as the editor builds it. */
export function editorFixture(atomCount: number, bonds: Bond[]) {
  const doc = new Y.Doc();
  const origin = { local: true };
  const undo = new Y.UndoManager([doc.getMap('beads'), doc.getMap('atoms')], { trackedOrigins: new Set([origin]), captureTimeout: 0 });
  const state = { selection: EMPTY as Selection, activeBead: null as string | null, readOnly: false, renamed: null as string | null };
  const suggestions = new Map<string, string | null>();
  const ctx = (): EditorContext => ({
    doc,
    origin,
    undo,
    readOnly: state.readOnly,
    view: mappingView(doc, bonds),
    atomCount,
    selection: state.selection,
    setSelection: (s) => (state.selection = s),
    activeBead: state.activeBead,
    setActiveBead: (id) => (state.activeBead = id),
    suggestions,
    ui: { toggleHydrogens() {}, toggleAtomNumbers() {}, toggleAtomColours() {}, fit() {}, zoom() {}, openHelp() {}, startRename: (id) => (state.renamed = id), propose() {} },
  });
  const select = (...atoms: number[]) => (state.selection = new Set(atoms));
  const command = (name: string) => editorCommands.find((c) => c.name === name)!;
  return { doc, origin, undo, state, suggestions, ctx, select, command };
}

/** A chain a–b–c–… of n atoms. */
export const chain = (n: number): Bond[] => Array.from({ length: n - 1 }, (_, i) => ({ a: i, b: i + 1, order: 1, aromatic: false }));
