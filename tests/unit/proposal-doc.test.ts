import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { ATOMS, BEADS, createBead, docToMapping } from '../../src/shared/mapping-doc';
import { applyChecked, checkDoc } from '../../src/shared/mapping-doc-check';
import { acceptGhosts, closeProposal, dismissGhosts, GHOST_PREFIX, openProposal, PROPOSAL, PROPOSAL_META, proposalOf, readOpenProposal } from '../../src/shared/proposal-doc';
import type { Proposal } from '../../src/shared/proposals';
import { sync, updateOf } from '../helpers/doc-updates';

const ATOM_COUNT = 10;
const by = { id: 7, name: 'Tomas Brenn', colour: '#1f4e5a' };
const proposal: Proposal = {
  cost: 1,
  beads: [
    { name: 'B1', atoms: [0, 1, 2], type: 'middle, 3 atoms', reason: '3 heavy atoms' },
    { name: 'B2', atoms: [3, 4], type: null, reason: '2 heavy atoms' },
    { name: 'B3', atoms: [5, 6], type: null, reason: '2 heavy atoms' },
  ],
};

const names = (doc: Y.Doc) => readOpenProposal(doc, ATOM_COUNT)?.beads.map((b) => b.name) ?? [];

describe('the open proposal in the draft', () => {
  it('is shared with every peer, and anyone who edits can accept a bead of it', () => {
    const proposer = new Y.Doc();
    const other = new Y.Doc();
    openProposal(proposer, proposal, 'all', by);
    sync(proposer, other);
    const open = readOpenProposal(other, ATOM_COUNT);
    expect(open?.meta).toMatchObject({ scope: 'all', by });
    expect(open?.beads.map((b) => [b.key, b.name, b.atoms])).toEqual([['g1', 'B1', [0, 1, 2]], ['g2', 'B2', [3, 4]], ['g3', 'B3', [5, 6]]]);
    // The other modeller accepts B2; the proposer sees the bead and one ghost fewer.
    acceptGhosts(other, [open!.beads[1]], null);
    sync(proposer, other);
    expect(docToMapping(proposer).beads.map((b) => b.name)).toEqual(['B2']);
    expect(names(proposer)).toEqual(['B1', 'B3']);
    // The proposal is no mapping data: versions and exports read docToMapping, which leaves it out.
    expect(Object.keys(docToMapping(proposer))).toEqual(['beads']);
  });

  it('accepts as one transaction that the accepting person undoes in one step, ghosts and all', () => {
    const doc = new Y.Doc();
    const origin = { local: true };
    const undo = new Y.UndoManager([doc.getMap(BEADS), doc.getMap(ATOMS), doc.getMap(PROPOSAL)], { trackedOrigins: new Set([origin]), captureTimeout: 0 });
    // An old bead holding atoms 3 and 4 is emptied by the accept and goes.
    createBead(doc, [3, 4], { name: 'Old' }, origin);
    openProposal(doc, proposal, 'all', by);
    undo.clear();
    let transactions = 0;
    doc.on('afterTransaction', () => transactions++);
    acceptGhosts(doc, readOpenProposal(doc, ATOM_COUNT)!.beads.slice(0, 2), origin);
    expect(transactions).toBe(1);
    expect(docToMapping(doc).beads.map((b) => [b.name, b.type ?? null, b.atoms.map((a) => a.index)])).toEqual([
      ['B1', 'middle, 3 atoms', [0, 1, 2]],
      ['B2', null, [3, 4]],
    ]);
    expect(names(doc)).toEqual(['B3']);
    undo.undo();
    expect(docToMapping(doc).beads.map((b) => b.name)).toEqual(['Old']);
    expect(names(doc)).toEqual(['B1', 'B2', 'B3']);
  });

  it('brings a ghost back on undo even after someone else decided the last one', () => {
    const a = new Y.Doc();
    const b = new Y.Doc();
    const origin = { local: true };
    const undo = new Y.UndoManager([a.getMap(BEADS), a.getMap(ATOMS), a.getMap(PROPOSAL)], { trackedOrigins: new Set([origin]), captureTimeout: 0 });
    openProposal(a, { cost: 1, beads: proposal.beads.slice(0, 2) }, 'all', by);
    acceptGhosts(a, [readOpenProposal(a, ATOM_COUNT)!.beads[0]], origin);
    sync(a, b);
    acceptGhosts(b, readOpenProposal(b, ATOM_COUNT)!.beads, null);
    sync(a, b);
    expect(names(a)).toEqual([]);
    undo.undo();
    sync(a, b);
    expect(names(b)).toEqual(['B1']);
    expect(docToMapping(b).beads.map((x) => x.name)).toEqual(['B2']);
  });

  it('gives an accepted ghost the next free name when the draft already uses its name', () => {
    const doc = new Y.Doc();
    createBead(doc, [7], { name: 'B1' });
    openProposal(doc, proposal, 'unassigned', by);
    acceptGhosts(doc, [readOpenProposal(doc, ATOM_COUNT)!.beads[0]], null);
    expect(docToMapping(doc).beads.map((b) => b.name).sort()).toEqual(['B1', 'B2']);
  });

  it('shows nothing once its last bead is decided; a new proposal replaces the open one', () => {
    const doc = new Y.Doc();
    openProposal(doc, proposal, 'all', by);
    dismissGhosts(doc, ['g1', 'g2']);
    expect(names(doc)).toEqual(['B3']);
    acceptGhosts(doc, readOpenProposal(doc, ATOM_COUNT)!.beads, null);
    expect([...proposalOf(doc).keys()]).toEqual([PROPOSAL_META]);
    expect(readOpenProposal(doc, ATOM_COUNT)).toBeNull();

    openProposal(doc, proposal, 'all', by);
    const first = readOpenProposal(doc, ATOM_COUNT)!.meta.id;
    openProposal(doc, { cost: 2, beads: [proposal.beads[2]] }, 'unassigned', { ...by, id: 8 });
    const open = readOpenProposal(doc, ATOM_COUNT)!;
    expect(open.meta.id).not.toBe(first);
    expect(open.meta.by.id).toBe(8);
    expect(open.beads.map((b) => b.name)).toEqual(['B3']);
    closeProposal(doc);
    expect(proposalOf(doc).size).toBe(0);
  });

  it('does not show a ghost of an older proposal (an undo may bring one back)', () => {
    const doc = new Y.Doc();
    openProposal(doc, proposal, 'all', by);
    proposalOf(doc).set(`${GHOST_PREFIX}old`, { p: 'another', name: 'X1', atoms: [9], type: null, reason: '' });
    expect(names(doc)).toEqual(['B1', 'B2', 'B3']);
  });
});

describe('the server’s checks of the proposal', () => {
  const base = () => {
    const doc = new Y.Doc();
    createBead(doc, [0, 1], { id: 'x' });
    return doc;
  };
  const check = (edit: (doc: Y.Doc) => void) => {
    const doc = base();
    return applyChecked(doc, updateOf(doc, edit), ATOM_COUNT);
  };

  it('accepts what the helpers write: open, accept, dismiss, close', () => {
    expect(check((d) => openProposal(d, proposal, 'all', by))).toBeNull();
    const doc = base();
    expect(applyChecked(doc, updateOf(doc, (d) => openProposal(d, proposal, 'all', by)), ATOM_COUNT)).toBeNull();
    expect(applyChecked(doc, updateOf(doc, (d) => acceptGhosts(d, readOpenProposal(d, ATOM_COUNT)!.beads.slice(0, 1), null)), ATOM_COUNT)).toBeNull();
    expect(applyChecked(doc, updateOf(doc, (d) => dismissGhosts(d, ['g2'])), ATOM_COUNT)).toBeNull();
    expect(applyChecked(doc, updateOf(doc, (d) => closeProposal(d)), ATOM_COUNT)).toBeNull();
    expect(checkDoc(doc, ATOM_COUNT)).toBeNull();
  });

  const ghost = { p: 'p1', name: 'B1', atoms: [0], type: null, reason: '' };
  it.each([
    ['an unknown key', (d: Y.Doc) => proposalOf(d).set('other', ghost), 'unknown_key'],
    ['a ghost of an atom the molecule does not have', (d: Y.Doc) => proposalOf(d).set('g:g1', { ...ghost, atoms: [ATOM_COUNT] }), 'atom_out_of_range'],
    ['a ghost with an extra field', (d: Y.Doc) => proposalOf(d).set('g:g1', { ...ghost, weight: 1 }), 'wrong_type'],
    ['a ghost without atoms', (d: Y.Doc) => proposalOf(d).set('g:g1', { ...ghost, atoms: [] }), 'wrong_type'],
    ['a ghost as a nested map', (d: Y.Doc) => proposalOf(d).set('g:g1', new Y.Map()), 'wrong_type'],
    ['a meta value with a bad scope', (d: Y.Doc) => proposalOf(d).set(PROPOSAL_META, { id: 'p1', scope: 'most', by }), 'wrong_type'],
    ['a meta value with a bad colour', (d: Y.Doc) => proposalOf(d).set(PROPOSAL_META, { id: 'p1', scope: 'all', by: { ...by, colour: 'red' } }), 'wrong_type'],
  ])('refuses %s', (_what, edit, code) => {
    expect(check(edit)?.code).toBe(code);
  });
});
