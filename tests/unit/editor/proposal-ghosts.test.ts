import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { createBead, docToMapping } from '../../../src/shared/mapping-doc';
import { acceptGhosts, ghostsFrom, readGhosts, readProposal, withoutGhosts } from '../../../src/features/editor/model/proposal-ghosts';

const proposal = ghostsFrom(
  {
    cost: 1,
    beads: [
      { name: 'B1', atoms: [0, 1, 2], type: 'middle, 3 atoms', reason: '3 heavy atoms' },
      { name: 'B2', atoms: [3, 4], type: null, reason: '2 heavy atoms' },
    ],
  },
  'all',
);

describe('proposal ghosts', () => {
  it('accepts ghosts as one transaction that the accepting person undoes in one step', () => {
    const doc = new Y.Doc();
    const origin = { local: true };
    const undo = new Y.UndoManager([doc.getMap('beads'), doc.getMap('atoms')], { trackedOrigins: new Set([origin]), captureTimeout: 0 });
    // An old bead holding atoms 3 and 4 is emptied by the accept and goes.
    createBead(doc, [3, 4], { name: 'Old' }, origin);
    undo.clear();
    let transactions = 0;
    doc.on('afterTransaction', () => transactions++);
    acceptGhosts(doc, proposal.beads, origin);
    expect(transactions).toBe(1);
    expect(docToMapping(doc).beads.map((b) => [b.name, b.type ?? null, b.atoms.map((a) => a.index)])).toEqual([
      ['B1', 'middle, 3 atoms', [0, 1, 2]],
      ['B2', null, [3, 4]],
    ]);
    undo.undo();
    expect(docToMapping(doc).beads.map((b) => b.name)).toEqual(['Old']);
  });

  it('gives an accepted ghost the next free name when the draft already uses its name', () => {
    const doc = new Y.Doc();
    createBead(doc, [7], { name: 'B1' });
    acceptGhosts(doc, [proposal.beads[0]], null);
    expect(docToMapping(doc).beads.map((b) => b.name).sort()).toEqual(['B1', 'B2']);
  });

  it('reads remote proposals defensively and drops what is not a ghost', () => {
    expect(readProposal({ scope: 'all', beads: [{ key: 'g1', name: 'B1', atoms: [0, 99, -1, 1.5, 'x'] }] }, 10)).toEqual({ scope: 'all', beads: [{ key: 'g1', name: 'B1', atoms: [0], type: null, reason: '' }] });
    expect(readProposal({ scope: 'everything', beads: [] }, 10)).toBeNull();
    expect(readProposal({ scope: 'all', beads: [{ key: 'g1', name: 'B1', atoms: [] }] }, 10)).toBeNull();
    expect(readProposal('B1', 10)).toBeNull();
    const states = new Map<number, Record<string, unknown>>([
      [2, { user: { name: 'Ann', colour: '#112233' }, proposal }],
      [1, { user: { name: 'Me', colour: 'red' }, proposal }],
      [3, { user: { name: 'Bo', colour: '#112233' } }],
    ]);
    const ghosts = readGhosts(states, 1, 10);
    expect(ghosts.map((g) => [g.user.name, g.isLocal, g.user.colour])).toEqual([['Me', true, '#555555'], ['Ann', false, '#112233']]);
  });

  it('takes settled ghosts out of the proposal', () => {
    expect(withoutGhosts(proposal, new Set(['g1']))?.beads.map((b) => b.name)).toEqual(['B2']);
    expect(withoutGhosts(proposal, new Set(['g1', 'g2']))).toBeNull();
  });
});
