import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { docToMapping, createBead } from '../../../src/shared/mapping-doc';
import { editorCommands } from '../../../src/features/editor/commands';
import { commandForKey, isAvailable, run } from '../../../src/features/editor/commands/registry';
import { chain, editorFixture } from './editor-fixture';

const key = (k: string, mods: Partial<{ shiftKey: boolean; ctrlKey: boolean; metaKey: boolean; altKey: boolean }> = {}) => ({
  key: k, shiftKey: false, ctrlKey: false, metaKey: false, altKey: false, ...mods,
});

const beadsOf = (doc: Y.Doc) => docToMapping(doc).beads.map((b) => ({ name: b.name, atoms: b.atoms.map((a) => [a.index, a.weight]) }));

describe('the command registry', () => {
  it('has unique names and no two commands on one key', () => {
    const names = editorCommands.map((c) => c.name);
    expect(new Set(names).size).toBe(names.length);
    for (const k of ['b', 'a', 'r', 'm', 's', 'w', 'n', 't', 'c', 'u', 'h', 'f', '+', '-', '?', 'Delete', 'Escape']) {
      expect(editorCommands.filter((c) => c.keyTest?.(key(k))).length, k).toBe(1);
    }
    expect(commandForKey(editorCommands, key('z', { ctrlKey: true }))?.name).toBe('undo');
    expect(commandForKey(editorCommands, key('Z', { ctrlKey: true, shiftKey: true }))?.name).toBe('redo');
    expect(commandForKey(editorCommands, key('b', { ctrlKey: true }))).toBeUndefined();
  });
});

describe('bead commands on a live document', () => {
  it('makes a bead, adds to it, splits and merges', () => {
    const f = editorFixture(6, chain(6));
    f.select(0, 1, 2);
    expect(run(f.command('make-bead'), f.ctx())).toBe(true);
    expect(beadsOf(f.doc)).toEqual([{ name: 'B1', atoms: [[0, 1], [1, 1], [2, 1]] }]);
    f.select(3);
    run(f.command('add-to-bead'), f.ctx());
    expect(beadsOf(f.doc)[0].atoms).toHaveLength(4);
    f.select(2, 3);
    run(f.command('split-bead'), f.ctx());
    expect(beadsOf(f.doc).map((b) => b.atoms.map(([i]) => i))).toEqual([[0, 1], [2, 3]]);
    f.select(1, 2);
    run(f.command('merge-beads'), f.ctx());
    expect(beadsOf(f.doc).map((b) => b.atoms.map(([i]) => i))).toEqual([[0, 1, 2, 3]]);
  });

  it('shares an atom evenly with the active bead and removes atoms from beads', () => {
    const f = editorFixture(4, chain(4));
    const b1 = createBead(f.doc, [0, 1], { name: 'P' }, f.origin);
    const b2 = createBead(f.doc, [2, 3], { name: 'Q' }, f.origin);
    f.state.activeBead = b2;
    f.select(1);
    run(f.command('share-atoms'), f.ctx());
    expect(f.doc.getMap('atoms').get('1')).toEqual({ [b1]: 0.5, [b2]: 0.5 });
    f.select(0, 1);
    run(f.command('remove-from-bead'), f.ctx());
    expect(f.doc.getMap('atoms').has('0')).toBe(false);
    expect(f.doc.getMap('atoms').has('1')).toBe(false);
  });

  it('applies the suggested type and cycles the centre rule of the target bead', () => {
    const f = editorFixture(3, chain(3));
    const id = createBead(f.doc, [0, 1, 2], {}, f.origin);
    f.select(0);
    expect(isAvailable(f.command('apply-suggested-type'), f.ctx())).toBe(false);
    f.suggestions.set(id, 'N2');
    run(f.command('apply-suggested-type'), f.ctx());
    expect(docToMapping(f.doc).beads[0].type).toBe('N2');
    expect(isAvailable(f.command('apply-suggested-type'), f.ctx())).toBe(false);
    run(f.command('cycle-centre'), f.ctx());
    expect(docToMapping(f.doc).beads[0].centre).toBe('geometry');
  });

  it('refuses every editing command when read-only, but still selects', () => {
    const f = editorFixture(3, chain(3));
    f.state.readOnly = true;
    f.select(0, 1);
    expect(run(f.command('make-bead'), f.ctx())).toBe(false);
    expect(f.doc.getMap('beads').size).toBe(0);
    expect(run(f.command('select-all'), f.ctx())).toBe(true);
    expect(f.state.selection.size).toBe(3);
  });
});

describe('per-user undo', () => {
  it('undoes only the local origin, leaving a collaborator’s edit alone', () => {
    const f = editorFixture(4, chain(4));
    f.select(0, 1);
    run(f.command('make-bead'), f.ctx());
    // A remote peer's change arrives as an update with another origin.
    const remote = new Y.Doc();
    Y.applyUpdate(remote, Y.encodeStateAsUpdate(f.doc));
    createBead(remote, [2, 3], { name: 'Theirs' });
    Y.applyUpdate(f.doc, Y.encodeStateAsUpdate(remote), 'remote');
    expect(beadsOf(f.doc).map((b) => b.name)).toEqual(['B1', 'Theirs']);
    run(f.command('undo'), f.ctx());
    expect(beadsOf(f.doc).map((b) => b.name)).toEqual(['Theirs']);
    expect(isAvailable(f.command('undo'), f.ctx())).toBe(false);
    run(f.command('redo'), f.ctx());
    expect(beadsOf(f.doc).map((b) => b.name)).toEqual(['B1', 'Theirs']);
  });
});

describe('empty beads', () => {
  it('are deleted when an edit takes their last atom', () => {
    const f = editorFixture(4, chain(4));
    createBead(f.doc, [0, 1], { name: 'P' }, f.origin);
    const q = createBead(f.doc, [2], { name: 'Q' }, f.origin);
    f.select(2);
    run(f.command('make-bead'), f.ctx());
    expect(f.doc.getMap('beads').has(q)).toBe(false);
    f.select(0, 1);
    run(f.command('remove-from-bead'), f.ctx());
    expect(docToMapping(f.doc).beads.map((b) => b.name)).toEqual(['B1']);
    // One undo step brings the bead and its atoms back together.
    run(f.command('undo'), f.ctx());
    expect(docToMapping(f.doc).beads.map((b) => b.name)).toEqual(['P', 'B1']);
  });
});
