import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { bondedParamsProblem, missingValues, parseTermKey, termKey } from '../../src/shared/bonded-terms';
import { applyChecked, checkDoc } from '../../src/shared/mapping-doc-check';
import { createBead, docToMapping, mappingToDoc, setBonded, setResidue } from '../../src/shared/mapping-doc';

// Bonded terms in the draft document: one canonical key per term, params checked on the way in
// (the live server applies every update with applyChecked), carried through docToMapping/mappingToDoc.

function update(edit: (doc: Y.Doc) => void, base: Y.Doc): Uint8Array {
  const copy = new Y.Doc();
  Y.applyUpdate(copy, Y.encodeStateAsUpdate(base));
  const before = Y.encodeStateVector(copy);
  edit(copy);
  return Y.encodeStateAsUpdate(copy, before);
}

describe('bonded terms in the draft', () => {
  it('keys a term the same in either direction', () => {
    expect(termKey('angle', ['c', 'b', 'a'])).toBe('angle:a,b,c');
    expect(termKey('dihedral', ['a', 'b', 'c', 'd'])).toBe(termKey('dihedral', ['d', 'c', 'b', 'a']));
    expect(parseTermKey('bond:a,b')).toEqual({ kind: 'bond', ids: ['a', 'b'] });
    expect(parseTermKey('bond:a,b,c')).toBeNull();
    expect(parseTermKey('spring:a,b')).toBeNull();
  });

  it('checks params per kind and names what is missing', () => {
    expect(bondedParamsProblem('bond', { function: 'harmonic', value: 0.47, k: 1250, constraint: true })).toBeNull();
    expect(bondedParamsProblem('bond', { function: 'harmonic', value: -1, k: 1 })).toMatch(/from 0.01 to 5 nm/);
    expect(bondedParamsProblem('angle', { function: 'harmonic', value: 100, k: 1, multiplicity: 2 })).toMatch(/Only a proper dihedral/);
    expect(bondedParamsProblem('bond', { function: 'harmonic', value: 0.4, k: 1, omit: true })).toMatch(/Only an angle or dihedral/);
    expect(missingValues({ kind: 'dihedral', value: null, k: null })).toEqual(['phase', 'force constant', 'multiplicity']);
    expect(missingValues({ kind: 'bond', value: 0.4, k: null, constraint: true })).toEqual([]);
    expect(missingValues({ kind: 'angle', value: null, k: null, omit: true })).toEqual([]);
  });

  it('the live check accepts valid terms and refuses bad keys and values', () => {
    const doc = new Y.Doc();
    const a = createBead(doc, [0], { id: 'a' });
    const b = createBead(doc, [1], { id: 'b' });
    expect(applyChecked(doc, update((d) => setBonded(d, { [termKey('bond', [a, b])]: { function: 'harmonic', value: 0.47, k: 1250 } }, 1), doc), 4)).toBeNull();
    expect(checkDoc(doc, 4)).toBeNull();
    expect(docToMapping(doc)).toMatchObject({ bonded: { 'bond:a,b': { function: 'harmonic', value: 0.47, k: 1250 } }, exclusions: 1 });
    const badValue = applyChecked(doc, update((d) => d.getMap('bonded').set('bond:a,b', { function: 'harmonic', value: 0.47, k: -5 }), doc), 4);
    expect(badValue?.message).toBeTruthy();
    const fresh = new Y.Doc();
    mappingToDoc(fresh, docToMapping(doc));
    expect(applyChecked(fresh, update((d) => d.getMap('bonded').set('twist:a,b', { function: 'harmonic', value: 0.5, k: 1 }), fresh), 4)?.code).toBe('unknown_key');
    expect(applyChecked(fresh, update((d) => d.getMap('settings').set('exclusions', 12), fresh), 4)?.code).toBe('wrong_type');
  });

  it('keeps the residue name as a setting: 1 to 3 upper-case letters or digits, carried through versions', () => {
    const doc = new Y.Doc();
    createBead(doc, [0], { id: 'a' });
    expect(applyChecked(doc, update((d) => setResidue(d, 'SAL'), doc), 4)).toBeNull();
    expect(docToMapping(doc).residue).toBe('SAL');
    const copy = new Y.Doc();
    mappingToDoc(copy, docToMapping(doc));
    expect(docToMapping(copy).residue).toBe('SAL');
    for (const bad of ['sal', 'TOOL', '', 'A B', 7]) expect(applyChecked(doc, update((d) => d.getMap('settings').set('residue', bad), doc), 4)?.code, String(bad)).toBe('wrong_type');
    expect(applyChecked(doc, update((d) => setResidue(d, null), doc), 4)).toBeNull();
    expect(docToMapping(doc).residue).toBeUndefined();
  });
});
