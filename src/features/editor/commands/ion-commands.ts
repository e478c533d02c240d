import { atomsOfBead, beadsOfAtom, createBead, deleteBead, removeAtoms } from '../../../shared/mapping-doc';
import type { EditorCommand, EditorContext } from './registry';

// A free counter-ion (Na+, Cl-) is a bead of its own in a CG model; one command maps them all.

/** The free ions that are not yet the only atom of a bead of their own. */
function ionsToMap(ctx: EditorContext): number[] {
  return (ctx.freeIons ?? []).filter((ion) => {
    const beads = beadsOfAtom(ctx.doc, ion);
    return !(beads.length === 1 && atomsOfBead(ctx.doc, beads[0]).length === 1);
  });
}

export const ionCommands: EditorCommand[] = [
  {
    name: 'free-ions-to-beads',
    label: 'Each free ion its own bead',
    group: 'beads',
    edits: true,
    enabled: (ctx) => ionsToMap(ctx).length > 0,
    perform(ctx) {
      const ions = ionsToMap(ctx);
      ctx.doc.transact(() => {
        const touched = new Set(ions.flatMap((ion) => beadsOfAtom(ctx.doc, ion)));
        removeAtoms(ctx.doc, ions, undefined, ctx.origin);
        for (const id of touched) if (atomsOfBead(ctx.doc, id).length === 0) deleteBead(ctx.doc, id, ctx.origin);
        for (const ion of ions) createBead(ctx.doc, [ion], {}, ctx.origin);
      }, ctx.origin);
    },
  },
];
