import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { beadsOf, createBead, docToMapping, mappingToDoc, setMeasured, setPartitionBasis, settingsOf } from '../../src/shared/mapping-doc';
import { applyChecked, checkDoc } from '../../src/shared/mapping-doc-check';
import { mappingSchema } from '../../src/shared/mapping-schema';
import { updateOf } from '../helpers/doc-updates';

// The draft's contract for a bead's measured partition value and the mapping's partition basis:
// written by the helpers, read back by docToMapping, refused by the collab server's checks when out
// of bounds.

const ATOMS = 6;


const shadowOf = (doc: Y.Doc) => {
  const copy = new Y.Doc();
  Y.applyUpdate(copy, Y.encodeStateAsUpdate(doc));
  return copy;
};

describe('measured values and the partition basis in the draft', () => {
  it('are written, read back and round-trip through mappingToDoc', () => {
    const doc = new Y.Doc();
    createBead(doc, [0, 1], { id: 'a' });
    setMeasured(doc, 'a', { kind: 'logP', value: 1.5, source: '  Hansch & Leo 1995  ' });
    setPartitionBasis(doc, 'atoms');
    const m = docToMapping(doc);
    expect(m).toEqual({
      beads: [{ id: 'a', name: 'B1', centre: 'mass', atoms: [{ index: 0, weight: 1 }, { index: 1, weight: 1 }], measured: { kind: 'logP', value: 1.5, source: 'Hansch & Leo 1995' } }],
      partitionBasis: 'atoms',
    });
    expect(checkDoc(doc, ATOMS)).toBeNull();
    expect(mappingSchema.safeParse(m).success).toBe(true);
    const copy = new Y.Doc();
    mappingToDoc(copy, m);
    expect(docToMapping(copy)).toEqual(m);
    setMeasured(doc, 'a', null);
    expect(docToMapping(doc).beads[0].measured).toBeUndefined();
  });

  it('a draft without them reads exactly as before (no new keys)', () => {
    const doc = new Y.Doc();
    createBead(doc, [0], { id: 'a' });
    expect(Object.keys(docToMapping(doc))).toEqual(['beads']);
    expect(Object.keys(docToMapping(doc).beads[0])).toEqual(['id', 'name', 'centre', 'atoms']);
  });

  it('the helpers refuse values outside the limits or without a source', () => {
    const doc = new Y.Doc();
    createBead(doc, [0], { id: 'a' });
    expect(() => setMeasured(doc, 'a', { kind: 'logP', value: 25, source: 'x' })).toThrow(/−20 to 20/);
    expect(() => setMeasured(doc, 'a', { kind: 'deltaG', value: -151, source: 'x' })).toThrow(/150/);
    expect(() => setMeasured(doc, 'a', { kind: 'logP', value: 1, source: '   ' })).toThrow(/source/);
    expect(() => setPartitionBasis(doc, 'median' as never)).toThrow(/fragment or atoms/);
    expect(docToMapping(doc).beads[0].measured).toBeUndefined();
  });

  it('the collab check refuses bad measured values and unknown settings sent by a peer', () => {
    const base = new Y.Doc();
    createBead(base, [0], { id: 'a' });
    const cases: [string, (d: Y.Doc) => void, RegExp][] = [
      ['value out of range', (d) => beadsOf(d).get('a')!.set('measured', { kind: 'logP', value: 99, source: 's' }), /−20 to 20/],
      ['no source', (d) => beadsOf(d).get('a')!.set('measured', { kind: 'deltaG', value: 1, source: '' }), /source/],
      ['extra key', (d) => beadsOf(d).get('a')!.set('measured', { kind: 'logP', value: 1, source: 's', unit: 'x' }), /only kind, value and source/],
      ['a nested map', (d) => beadsOf(d).get('a')!.set('measured', new Y.Map()), /plain object/],
      ['unknown basis', (d) => settingsOf(d).set('partitionBasis', 'median'), /fragment or atoms/],
      ['unknown setting', (d) => settingsOf(d).set('temperature', 310), /only partitionBasis/],
    ];
    for (const [, edit, message] of cases) {
      const problem = applyChecked(shadowOf(base), updateOf(base, edit), ATOMS);
      expect(problem?.message).toMatch(message);
    }
    const good = applyChecked(shadowOf(base), updateOf(base, (d) => (setMeasured(d, 'a', { kind: 'deltaG', value: -12.5, source: 'own run' }), setPartitionBasis(d, 'fragment'))), ATOMS);
    expect(good).toBeNull();
  });

  it('the API schema refuses the same', () => {
    const bead = { id: 'a', name: 'A', centre: 'mass', atoms: [{ index: 0, weight: 1 }] };
    expect(mappingSchema.safeParse({ beads: [{ ...bead, measured: { kind: 'logP', value: 21, source: 's' } }] }).success).toBe(false);
    expect(mappingSchema.safeParse({ beads: [{ ...bead, measured: { kind: 'logP', value: 2, source: '' } }] }).success).toBe(false);
    expect(mappingSchema.safeParse({ beads: [bead], partitionBasis: 'median' }).success).toBe(false);
  });
});
