import { CENTRE_RULES, assignAtoms, atomsOfBead, createBead, deleteBead, mergeBeads, removeAtoms, setCentre, setType, shareAtom, splitBead } from '../../../shared/mapping-doc';
import { beadsTouching } from '../model/bead-view';
import { sorted } from '../model/selection';
import { plainKey, type EditorCommand, type EditorContext } from './registry';

// Commands that change beads. Each is one transaction, so one undo step and one network update.

const hasSelection = (ctx: EditorContext) => ctx.selection.size > 0;
const active = (ctx: EditorContext) => (ctx.activeBead && ctx.view.byId.has(ctx.activeBead) ? ctx.activeBead : null);

/** The bead a command acts on: the active one, else the only bead the selection touches. */
export function targetBead(ctx: EditorContext): string | null {
  const a = active(ctx);
  if (a) return a;
  const touched = beadsTouching(ctx.view, ctx.selection);
  return touched.length === 1 ? touched[0] : null;
}

/**
 * Runs an edit in one transaction and then deletes the beads it left without atoms (moving an
 * atom out of a bead should not leave an empty bead behind to clutter the table).
 */
function editAndPrune(ctx: EditorContext, edit: () => void): void {
  const before = beadsTouching(ctx.view, ctx.selection);
  ctx.doc.transact(() => {
    edit();
    for (const id of before) if (atomsOfBead(ctx.doc, id).length === 0) deleteBead(ctx.doc, id, ctx.origin);
  }, ctx.origin);
}

export const beadCommands: EditorCommand[] = [
  {
    name: 'make-bead',
    label: 'Make bead',
    group: 'beads',
    shortcut: 'B',
    keyTest: plainKey('b'),
    edits: true,
    enabled: hasSelection,
    perform(ctx) {
      let id = '';
      editAndPrune(ctx, () => (id = createBead(ctx.doc, sorted(ctx.selection), {}, ctx.origin)));
      ctx.setActiveBead(id);
    },
  },
  {
    name: 'add-to-bead',
    label: 'Add to bead',
    group: 'beads',
    shortcut: 'A',
    keyTest: plainKey('a'),
    edits: true,
    enabled: (ctx) => hasSelection(ctx) && active(ctx) !== null,
    perform: (ctx) => editAndPrune(ctx, () => assignAtoms(ctx.doc, active(ctx)!, sorted(ctx.selection), ctx.origin)),
  },
  {
    name: 'remove-from-bead',
    label: 'Remove from beads',
    group: 'beads',
    shortcut: 'R',
    keyTest: plainKey('r'),
    edits: true,
    enabled: (ctx) => beadsTouching(ctx.view, ctx.selection).length > 0,
    perform(ctx) {
      editAndPrune(ctx, () => removeAtoms(ctx.doc, sorted(ctx.selection), undefined, ctx.origin));
      ctx.setActiveBead(null);
    },
  },
  {
    name: 'merge-beads',
    label: 'Merge beads',
    group: 'beads',
    shortcut: 'M',
    keyTest: plainKey('m'),
    edits: true,
    enabled: (ctx) => beadsTouching(ctx.view, ctx.selection).length > 1,
    perform(ctx) {
      const touched = beadsTouching(ctx.view, ctx.selection);
      const into = active(ctx) && touched.includes(active(ctx)!) ? active(ctx)! : touched[0];
      mergeBeads(ctx.doc, into, touched.filter((id) => id !== into), ctx.origin);
      ctx.setActiveBead(into);
    },
  },
  {
    name: 'split-bead',
    label: 'Split off',
    group: 'beads',
    shortcut: 'S',
    keyTest: plainKey('s'),
    edits: true,
    enabled(ctx) {
      const id = targetBead(ctx);
      if (!id || !hasSelection(ctx)) return false;
      const inBead = ctx.view.byId.get(id)!.atoms.filter((a) => ctx.selection.has(a.index)).length;
      return inBead > 0 && inBead < ctx.view.byId.get(id)!.atoms.length;
    },
    perform(ctx) {
      const id = splitBead(ctx.doc, targetBead(ctx)!, sorted(ctx.selection), {}, ctx.origin);
      ctx.setActiveBead(id);
    },
  },
  {
    name: 'share-atoms',
    label: 'Share with bead',
    group: 'beads',
    shortcut: 'W',
    keyTest: plainKey('w'),
    edits: true,
    enabled: (ctx) => hasSelection(ctx) && active(ctx) !== null && sorted(ctx.selection).some((a) => !(ctx.view.atomBeads.get(a) ?? []).includes(active(ctx)!)),
    perform(ctx) {
      // Each selected atom is split evenly between the beads it was in and the active bead.
      const target = active(ctx)!;
      ctx.doc.transact(() => {
        for (const a of sorted(ctx.selection)) {
          const ids = [...new Set([...(ctx.view.atomBeads.get(a) ?? []), target])];
          shareAtom(ctx.doc, a, Object.fromEntries(ids.map((id) => [id, 1 / ids.length])), ctx.origin);
        }
      }, ctx.origin);
    },
  },
  {
    name: 'delete-bead',
    label: 'Delete bead',
    group: 'beads',
    shortcut: 'Del',
    keyTest: plainKey('Delete', 'Backspace'),
    edits: true,
    enabled: (ctx) => targetBead(ctx) !== null,
    perform(ctx) {
      deleteBead(ctx.doc, targetBead(ctx)!, ctx.origin);
      ctx.setActiveBead(null);
    },
  },
  {
    name: 'rename-bead',
    label: 'Rename bead',
    group: 'beads',
    shortcut: 'N',
    keyTest: plainKey('n', 'F2'),
    edits: true,
    enabled: (ctx) => targetBead(ctx) !== null,
    perform: (ctx) => ctx.ui.startRename(targetBead(ctx)!),
  },
  {
    name: 'apply-suggested-type',
    label: 'Use suggested type',
    group: 'beads',
    shortcut: 'T',
    keyTest: plainKey('t'),
    edits: true,
    enabled(ctx) {
      const id = targetBead(ctx);
      const suggestion = id ? ctx.suggestions.get(id) : null;
      return !!suggestion && ctx.view.byId.get(id!)?.type !== suggestion;
    },
    perform(ctx) {
      const id = targetBead(ctx)!;
      setType(ctx.doc, id, ctx.suggestions.get(id)!, ctx.origin);
    },
  },
  {
    name: 'cycle-centre',
    label: 'Next centre rule',
    group: 'beads',
    shortcut: 'C',
    keyTest: plainKey('c'),
    edits: true,
    enabled: (ctx) => targetBead(ctx) !== null,
    perform(ctx) {
      const bead = ctx.view.byId.get(targetBead(ctx)!)!;
      const next = CENTRE_RULES[(CENTRE_RULES.indexOf(bead.centre) + 1) % CENTRE_RULES.length];
      setCentre(ctx.doc, bead.id, next, ctx.origin);
    },
  },
];
