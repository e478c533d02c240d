import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { ATOMS, atomsOf, BEADS, createBead, docToMapping, shareAtom } from '../../src/shared/mapping-doc';
import { applyChecked, checkDoc } from '../../src/shared/mapping-doc-check';
import { checkUpdateStructs } from '../../src/shared/mapping-update-check';
import { acceptGhosts, closeProposal, dismissGhosts, GHOST_PREFIX, ghostProblem, openProposal, PROPOSAL, PROPOSAL_META, proposalOf, readOpenProposal } from '../../src/shared/proposal-doc';
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

// Two ghosts sharing atom 2 half and half (hand-worked: 0.5 + 0.5 = 1), as a symmetric ring system's
// proposal shares a CH2 between two bridgehead beads; B3 takes atom 4 wholly.
const sharing: Proposal = {
  cost: 1,
  beads: [
    { name: 'B1', atoms: [0, 1, 2], weights: [1, 1, 0.5], type: null, reason: 'bridgehead 0' },
    { name: 'B2', atoms: [2, 3], weights: [0.5, 1], type: null, reason: 'bridgehead 3' },
    { name: 'B3', atoms: [4], type: null, reason: 'one heavy atom' },
  ],
};
const weightsOf = (doc: Y.Doc) => docToMapping(doc).beads.map((b) => [b.name, b.atoms.map((a) => [a.index, a.weight])]);
const idsByName = (doc: Y.Doc) => Object.fromEntries(docToMapping(doc).beads.map((b) => [b.name, b.id]));

describe('ghosts that share atoms', () => {
  const open = () => {
    const doc = new Y.Doc();
    openProposal(doc, sharing, 'all', by);
    return doc;
  };
  const ghost = (doc: Y.Doc, name: string) => readOpenProposal(doc, ATOM_COUNT)!.beads.find((b) => b.name === name)!;

  it('keeps the weights in the document and reads them back; a ghost without shared atoms keeps five keys', () => {
    const doc = open();
    expect(proposalOf(doc).get('g:g1')).toEqual({ p: expect.any(String), name: 'B1', atoms: [0, 1, 2], weights: [1, 1, 0.5], type: null, reason: 'bridgehead 0' });
    expect(Object.keys(proposalOf(doc).get('g:g3') as object).sort()).toEqual(['atoms', 'name', 'p', 'reason', 'type']);
    expect(readOpenProposal(doc, ATOM_COUNT)!.beads.map((b) => [b.name, b.weights])).toEqual([['B1', [1, 1, 0.5]], ['B2', [0.5, 1]], ['B3', undefined]]);
    expect('weights' in ghost(doc, 'B3')).toBe(false);
  });

  it('accepted one after the other, gives the shared atom to both beads half and half', () => {
    const doc = open();
    acceptGhosts(doc, [ghost(doc, 'B1')], null);
    // Until the second is accepted, atom 2 is half in B1 only (the checks report the sum below 1).
    expect(atomsOf(doc).get('2')).toEqual({ [idsByName(doc).B1]: 0.5 });
    acceptGhosts(doc, [ghost(doc, 'B2')], null);
    const ids = idsByName(doc);
    expect(atomsOf(doc).get('2')).toEqual({ [ids.B1]: 0.5, [ids.B2]: 0.5 });
    expect(weightsOf(doc)).toEqual([
      ['B1', [[0, 1], [1, 1], [2, 0.5]]],
      ['B2', [[2, 0.5], [3, 1]]],
    ]);
  });

  it('accepted in the other order or both at once, gives the same entries', () => {
    const reversed = open();
    acceptGhosts(reversed, [ghost(reversed, 'B2')], null);
    acceptGhosts(reversed, [ghost(reversed, 'B1')], null);
    const together = open();
    const origin = { local: true };
    let transactions = 0;
    together.on('afterTransaction', () => transactions++);
    acceptGhosts(together, readOpenProposal(together, ATOM_COUNT)!.beads, origin);
    expect(transactions).toBe(1);
    for (const doc of [reversed, together]) {
      const ids = idsByName(doc);
      expect(atomsOf(doc).get('2')).toEqual({ [ids.B1]: 0.5, [ids.B2]: 0.5 });
      expect(weightsOf(doc).filter(([name]) => name !== 'B3')).toEqual([
        ['B1', [[0, 1], [1, 1], [2, 0.5]]],
        ['B2', [[2, 0.5], [3, 1]]],
      ]);
    }
    expect(weightsOf(together).map(([name]) => name)).toEqual(['B1', 'B2', 'B3']);
  });

  it('takes a shared atom out of a hand-made bead that held it wholly, deletes the bead left empty, and undoes in one step', () => {
    const doc = new Y.Doc();
    const origin = { local: true };
    const undo = new Y.UndoManager([doc.getMap(BEADS), doc.getMap(ATOMS), doc.getMap(PROPOSAL)], { trackedOrigins: new Set([origin]), captureTimeout: 0 });
    const hand = createBead(doc, [2, 7], { name: 'Hand' }, origin);
    const lone = createBead(doc, [9], { name: 'Lone' }, origin);
    // Atom 9 is half in Lone and shared by the proposal at 0.5: both fit, so Lone keeps its half.
    openProposal(doc, { cost: 1, beads: [...sharing.beads.slice(0, 1), { name: 'B4', atoms: [8, 9], weights: [1, 0.5], type: null, reason: '' }] }, 'all', by);
    shareAtom(doc, 9, { [lone]: 0.5 }, origin);
    undo.clear();
    const before = atomsOf(doc).toJSON();
    acceptGhosts(doc, readOpenProposal(doc, ATOM_COUNT)!.beads, origin);
    const ids = idsByName(doc);
    expect(atomsOf(doc).get('2')).toEqual({ [ids.B1]: 0.5 });
    expect(atomsOf(doc).get('7')).toEqual({ [hand]: 1 });
    expect(atomsOf(doc).get('9')).toEqual({ [lone]: 0.5, [ids.B4]: 0.5 });
    expect(weightsOf(doc).map(([name]) => name)).toEqual(['B1', 'Hand', 'B4', 'Lone']);

    // Over an atom that is the only one of a hand-made bead: the bead goes.
    const other = open();
    createBead(other, [3], { name: 'Only' });
    acceptGhosts(other, [ghost(other, 'B2')], null);
    expect(docToMapping(other).beads.map((b) => b.name)).toEqual(['B2']);
    // A share that no longer fits (0.5 kept + 0.75 > 1) replaces the kept one.
    shareAtom(other, 2, { [idsByName(other).B2]: 0.5 });
    openProposal(other, { cost: 1, beads: [{ name: 'B5', atoms: [2], weights: [0.75], type: null, reason: '' }] }, 'all', by);
    acceptGhosts(other, readOpenProposal(other, ATOM_COUNT)!.beads, null);
    expect(atomsOf(other).get('2')).toEqual({ [idsByName(other).B5]: 0.75 });

    undo.undo();
    expect(atomsOf(doc).toJSON()).toEqual(before);
    expect(docToMapping(doc).beads.map((b) => b.name).sort()).toEqual(['Hand', 'Lone']);
    expect(readOpenProposal(doc, ATOM_COUNT)!.beads.map((b) => [b.name, b.weights])).toEqual([['B1', [1, 1, 0.5]], ['B4', [1, 0.5]]]);
  });

  it('takes a shared atom out of a hand-made bead wholly, deleting the bead when that was its last atom', () => {
    const doc = open();
    const hand = createBead(doc, [2], { name: 'Hand' });
    acceptGhosts(doc, [ghost(doc, 'B1')], null);
    expect(docToMapping(doc).beads.map((b) => b.name)).toEqual(['B1']);
    expect(atomsOf(doc).get('2')).toEqual({ [idsByName(doc).B1]: 0.5 });
    expect(Object.keys(atomsOf(doc).get('2')!)).not.toContain(hand);
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
    ['a ghost with weights of the wrong length', (d: Y.Doc) => proposalOf(d).set('g:g1', { ...ghost, weights: [0.5, 0.5] }), 'wrong_type'],
    ['a ghost with a weight of 0', (d: Y.Doc) => proposalOf(d).set('g:g1', { ...ghost, weights: [0] }), 'wrong_type'],
    ['a ghost with a weight above 1', (d: Y.Doc) => proposalOf(d).set('g:g1', { ...ghost, weights: [1.5] }), 'wrong_type'],
    ['a ghost with weights and an extra field', (d: Y.Doc) => proposalOf(d).set('g:g1', { ...ghost, weights: [0.5], weight: 1 }), 'wrong_type'],
  ])('refuses %s', (_what, edit, code) => {
    expect(check(edit)?.code).toBe(code);
  });

  it('accepts ghosts with weights and what accepting them writes', () => {
    const doc = base();
    expect(applyChecked(doc, updateOf(doc, (d) => openProposal(d, sharing, 'all', by)), ATOM_COUNT)).toBeNull();
    expect(applyChecked(doc, updateOf(doc, (d) => acceptGhosts(d, readOpenProposal(d, ATOM_COUNT)!.beads, null)), ATOM_COUNT)).toBeNull();
    expect(checkDoc(doc, ATOM_COUNT)).toBeNull();
    // The draft's bead "x" was named B1, so the ghosts were renamed: both halves are there all the same.
    expect(Object.values(atomsOf(doc).get('2')!)).toEqual([0.5, 0.5]);
    expect(docToMapping(doc).beads.filter((b) => b.atoms.some((a) => a.index === 2 && a.weight === 0.5))).toHaveLength(2);
  });

  it('refuses malformed weights already in the update’s structs (mapping-update-check.ts)', () => {
    const doc = base();
    const good = updateOf(doc, (d) => proposalOf(d).set('g:g1', { ...ghost, weights: [0.5] }));
    expect(checkUpdateStructs(good, ATOM_COUNT)).toBeNull();
    for (const weights of [[0.5, 0.5], [0], [-0.5], [2], ['0.5'], [Number.NaN], 0.5]) {
      const bad = updateOf(doc, (d) => proposalOf(d).set('g:g1', { ...ghost, weights }));
      expect(checkUpdateStructs(bad, ATOM_COUNT)).toMatchObject({ code: 'wrong_type', message: expect.stringMatching(/proposed bead's weights/) });
    }
  });
});

describe('ghostProblem and weights', () => {
  const ghost = { p: 'p1', name: 'B1', atoms: [0, 1], type: null, reason: '' };
  it('takes weights as long as the atoms, each in (0, 1]', () => {
    expect(ghostProblem(ghost)).toBeNull();
    expect(ghostProblem({ ...ghost, weights: [1, 0.5] })).toBeNull();
    expect(ghostProblem({ ...ghost, weights: [1 / 3, 1] })).toBeNull();
  });
  it.each([
    ['of the wrong length', [0.5], /as long as its atoms/],
    ['that are no list', 0.5, /as long as its atoms/],
    ['of 0', [0, 1], /greater than 0 and at most 1/],
    ['below 0', [-0.5, 1], /greater than 0 and at most 1/],
    ['above 1', [1.5, 0.5], /greater than 0 and at most 1/],
    ['that are not numbers', ['0.5', 1], /greater than 0 and at most 1/],
    ['that are not finite', [Number.POSITIVE_INFINITY, 1], /greater than 0 and at most 1/],
    ['of null', [null, 1], /greater than 0 and at most 1/],
  ])('refuses weights %s', (_what, weights, message) => {
    expect(ghostProblem({ ...ghost, weights })).toMatch(message);
  });
  it('refuses a sixth key other than weights', () => {
    expect(ghostProblem({ ...ghost, weight: 1 })).toMatch(/holds only p, name, atoms, type and reason/);
  });
});
