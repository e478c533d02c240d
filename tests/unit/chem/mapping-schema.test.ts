import { describe, expect, it } from 'vitest';
import { evaluateBodySchema, mappingSchema, moleculeBodySchema } from '../../../src/shared/mapping-schema';

describe('shared chemistry schemas', () => {
  it('accept the documented bodies', () => {
    expect(moleculeBodySchema.safeParse({ smiles: 'CCO' }).success).toBe(true);
    expect(moleculeBodySchema.safeParse({ molfile: '\n  x\n\n  0  0  0  0  0  0  0  0  0  0999 V2000\nM  END\n' }).success).toBe(true);
    const body = {
      smiles: 'CCCC',
      mapping: { beads: [{ id: 'a', name: 'A', centre: 'mass', atoms: [{ index: 0, weight: 1 }, { index: 1 }] }] },
      options: { temperature: 310, resolution: '3:1' },
    };
    const parsed = evaluateBodySchema.parse(body);
    expect(parsed.mapping.beads[0].atoms[1].weight).toBe(1);
  });

  it('refuse unknown keys, both inputs, and over-long SMILES, with clear messages', () => {
    const extra = moleculeBodySchema.safeParse({ smiles: 'CCO', name: 'x' });
    expect(extra.success).toBe(false);
    expect(moleculeBodySchema.safeParse({ smiles: 'CCO', molfile: 'x' }).success).toBe(false);
    const long = moleculeBodySchema.safeParse({ smiles: 'C'.repeat(5001) });
    expect(long.error?.issues[0].message).toBe('A SMILES string has at most 5000 characters.');
    expect(moleculeBodySchema.safeParse({ smiles: '' }).error?.issues[0].message).toBe('The SMILES string is empty.');
  });

  it('refuse bad mappings', () => {
    const bead = (over: object) => ({ beads: [{ id: 'a', name: 'A', centre: 'mass', atoms: [{ index: 0, weight: 1 }], ...over }] });
    const msg = (v: unknown) => mappingSchema.safeParse(v).error?.issues[0].message;
    expect(msg(bead({ atoms: [{ index: -1, weight: 1 }] }))).toBe('An atom index is 0 or more.');
    expect(msg(bead({ atoms: [{ index: 0.5, weight: 1 }] }))).toBe('An atom index is a whole number.');
    expect(msg(bead({ atoms: [{ index: 0, weight: -1 }] }))).toBe('A weight must be above 0.');
    expect(msg(bead({ centre: 'middle' }))).toBe('The centre rule is mass, geometry or geometry-heavy.');
    expect(msg({ beads: [bead({}).beads[0], bead({}).beads[0]] })).toBe('Bead ids must be unique.');
    expect(mappingSchema.safeParse({ beads: [], extra: 1 }).success).toBe(false);
  });
});
