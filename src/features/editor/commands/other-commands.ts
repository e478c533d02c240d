import { unassignedAtoms } from '../model/bead-view';
import { EMPTY, selectMany } from '../model/selection';
import { modKey, plainKey, type EditorCommand } from './registry';

// Selection, history and view commands.

export const selectionCommands: EditorCommand[] = [
  {
    name: 'select-all',
    label: 'Select all atoms',
    group: 'selection',
    shortcut: 'Ctrl A',
    keyTest: modKey('a'),
    edits: false,
    perform: (ctx) => ctx.setSelection(selectMany(EMPTY, Array.from({ length: ctx.atomCount }, (_, i) => i), false)),
  },
  {
    name: 'select-unassigned',
    label: 'Select unassigned atoms',
    group: 'selection',
    shortcut: 'U',
    keyTest: plainKey('u'),
    edits: false,
    perform: (ctx) => ctx.setSelection(selectMany(EMPTY, unassignedAtoms(ctx.view, ctx.atomCount), false)),
  },
  {
    name: 'clear-selection',
    label: 'Clear selection',
    group: 'selection',
    shortcut: 'Esc',
    keyTest: plainKey('Escape'),
    edits: false,
    perform(ctx) {
      ctx.setSelection(EMPTY);
      ctx.setActiveBead(null);
    },
  },
];

export const historyCommands: EditorCommand[] = [
  {
    name: 'undo',
    label: 'Undo',
    group: 'history',
    shortcut: 'Ctrl Z',
    keyTest: modKey('z'),
    edits: true,
    enabled: (ctx) => ctx.undo.canUndo(),
    perform: (ctx) => void ctx.undo.undo(),
  },
  {
    name: 'redo',
    label: 'Redo',
    group: 'history',
    shortcut: 'Ctrl Shift Z',
    keyTest: (e) => modKey('z', true)(e) || modKey('y')(e),
    edits: true,
    enabled: (ctx) => ctx.undo.canRedo(),
    perform: (ctx) => void ctx.undo.redo(),
  },
];

export const viewCommands: EditorCommand[] = [
  { name: 'toggle-hydrogens', label: 'Show or hide hydrogens', group: 'view', shortcut: 'H', keyTest: plainKey('h'), edits: false, perform: (ctx) => ctx.ui.toggleHydrogens() },
  { name: 'toggle-atom-numbers', label: 'Show or hide atom numbers', group: 'view', shortcut: 'I', keyTest: plainKey('i'), edits: false, perform: (ctx) => ctx.ui.toggleAtomNumbers() },
  { name: 'toggle-atom-colours', label: 'Colour atoms by bead', group: 'view', shortcut: 'K', keyTest: plainKey('k'), edits: false, perform: (ctx) => ctx.ui.toggleAtomColours() },
  { name: 'fit-view', label: 'Fit molecule to view', group: 'view', shortcut: 'F', keyTest: plainKey('f', '0'), edits: false, perform: (ctx) => ctx.ui.fit() },
  { name: 'zoom-in', label: 'Zoom in', group: 'view', shortcut: '+', keyTest: plainKey('+', '='), edits: false, perform: (ctx) => ctx.ui.zoom(1.25) },
  { name: 'zoom-out', label: 'Zoom out', group: 'view', shortcut: '−', keyTest: plainKey('-', '_'), edits: false, perform: (ctx) => ctx.ui.zoom(0.8) },
  { name: 'show-shortcuts', label: 'Keyboard shortcuts', group: 'view', shortcut: '?', keyTest: plainKey('?'), edits: false, perform: (ctx) => ctx.ui.openHelp() },
];
