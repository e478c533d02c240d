import { describe, expect, it } from 'vitest';
import { evaluateMapping, parseMolecule, type BeadType, type Mapping } from '../../../server/chem/index';
import { roundCharge } from '../../../server/chem/suggest';
import { logPFromFreeEnergy, partitionFreeEnergy } from '../../../server/chem/partition';
import { DEMO_LIBRARY } from '../../../server/chem/demo-library';
import { beadsFrom } from './helpers';
import { warmUpChemistry } from './warm-up';

warmUpChemistry();

const bead = (id: string, atoms: [number, number][], extra: Partial<Mapping['beads'][number]> = {}) => ({ id, name: id.toUpperCase(), centre: 'mass' as const, atoms: atoms.map(([index, weight]) => ({ index, weight })), ...extra });

describe('ionic beads (no partition value)', () => {
  it('the sulfonate bead of dodecyl sulfate is ionic: n/a partition, raw sum kept apart, type from charge and size', async () => {
    const sds = await parseMolecule({ smiles: 'CCCCCCCCCCCCOS(=O)(=O)[O-]' }); // 12 O, 13 S, 14–16 O
    const ev = evaluateMapping(sds, beadsFrom([[0, 1, 2, 3], [4, 5, 6, 7], [8, 9, 10, 11], [12, 13, 14, 15, 16]]));
    const head = ev.beads[3];
    expect([head.ionic, head.charge]).toEqual([true, -1]);
    expect([head.logP, head.deltaG, head.fragmentLogP, head.fragmentDeltaG, head.partitionDeltaG]).toEqual([null, null, null, null, null]);
    expect(head.partitionSource).toBe('ionic');
    expect(head.additiveLogPIonic).toBeCloseTo(sds.atomLogP.slice(12).reduce((s, v) => s + v, 0), 12);
    // 5 heavy atoms → size class 4; the demo library's 4-atom anion, by charge and size alone.
    expect([head.sizeClass, head.suggestedType, head.suggestedTypeFits]).toEqual([4, 'anion, 4 atoms', true]);
    expect(ev.checks.find((c) => c.code === 'ionic_bead')?.message).toMatch(/n\/a \(ionic\)/);
    expect(ev.beads[0].ionic).toBe(false);
    expect(ev.beads[0].logP).not.toBeNull();
  });

  it('a free Na⁺ and NH₄⁺ are ionic; a nitro bead (net 0) is not', async () => {
    const salt = await parseMolecule({ smiles: 'CCCCC(=O)[O-].[Na+]' });
    const ev = evaluateMapping(salt, beadsFrom([[0, 1, 2], [3, 4, 5, 6], [7]]));
    expect(ev.beads.map((b) => b.ionic)).toEqual([false, true, true]);
    expect(ev.beads[2].logP).toBeNull();
    const ammonium = await parseMolecule({ smiles: '[NH4+]' });
    expect(evaluateMapping(ammonium, beadsFrom([[0]])).beads[0]).toMatchObject({ ionic: true, logP: null, deltaG: null });
    const nitro = await parseMolecule({ smiles: 'CC[N+](=O)[O-]' });
    const n = evaluateMapping(nitro, beadsFrom([[0, 1, 2, 3, 4]]));
    expect([n.beads[0].ionic, n.beads[0].charge]).toEqual([false, 0]);
    expect(n.beads[0].logP).not.toBeNull();
  });
});

describe('fractional charge (hand-worked)', () => {
  it('is the exact weighted sum, symmetric for a shared O⁻ and a shared N⁺', async () => {
    // Acetate with its O⁻ shared 0.5/0.5: −0.5 and −0.5; the mirror cation C[NH3+] shared likewise: +0.5 and +0.5.
    const acetate = await parseMolecule({ smiles: 'CC(=O)[O-]' });
    const a = evaluateMapping(acetate, { beads: [bead('a', [[0, 1], [1, 1], [3, 0.5]]), bead('b', [[2, 1], [3, 0.5]])] });
    expect(a.beads.map((b) => b.charge)).toEqual([-0.5, -0.5]);
    const ammonium = await parseMolecule({ smiles: 'CC[NH3+]' });
    const n = evaluateMapping(ammonium, { beads: [bead('a', [[0, 1], [2, 0.5]]), bead('b', [[1, 1], [2, 0.5]])] });
    expect(n.beads.map((b) => b.charge)).toEqual([0.5, 0.5]);
    // 0.7 + 0.2 would be 0.8999999999999999 in floating point; the sum is reported as 0.9.
    const c = evaluateMapping(ammonium, { beads: [bead('a', [[0, 1], [2, 0.7]]), bead('b', [[1, 1], [2, 0.2]])] });
    expect(c.beads.map((b) => b.charge)).toEqual([0.7, 0.2]);
    // Both halves are ionic, and the suggestions are mirror images: anion and cation, never neutral.
    const small: BeadType[] = DEMO_LIBRARY.filter((t) => t.heavyAtomsPerBead === 2);
    const aq = evaluateMapping(acetate, { beads: [bead('a', [[0, 1], [1, 1], [3, 0.5]]), bead('b', [[2, 1], [3, 0.5]])] }, { library: small });
    const nq = evaluateMapping(ammonium, { beads: [bead('a', [[0, 1], [2, 0.5]]), bead('b', [[1, 1], [2, 0.5]])] }, { library: small });
    expect(aq.beads[1].suggestedType).toBe('anion, 2 atoms'); // O + ½ O⁻: 1.5 heavy atoms, class 2
    expect(nq.beads[0].suggestedType).toBe('cation, 2 atoms');
  });

  it('rounds half away from zero', () => {
    expect([-1.5, -0.5, -0.49, 0, 0.49, 0.5, 1.5].map(roundCharge)).toEqual([-2, -1, 0, 0, 0, 1, 2]);
  });
});

describe('type_size_mismatch', () => {
  it('is reported when the assigned type is for another size class, and not when it fits', async () => {
    const hexane = await parseMolecule({ smiles: 'CCCCCC' });
    const ev = evaluateMapping(hexane, { beads: [bead('a', [[0, 1], [1, 1], [2, 1], [3, 1]], { type: 'middle, 3 atoms' }), bead('b', [[4, 1], [5, 1]], { type: 'middle, 2 atoms' })] });
    const c = ev.checks.filter((x) => x.code === 'type_size_mismatch');
    expect(c.map((x) => x.beads)).toEqual([['a']]);
    expect(c[0].message).toContain('size class 4');
  });
});

describe('partition basis and measured values', () => {
  it('suggestions follow the mapping basis; a measured value wins over both', async () => {
    // Propranolol-like: the basis decides which ΔG the suggestion uses.
    const m = await parseMolecule({ smiles: 'CC(C)NCC(O)COc1cccc2ccccc12' });
    const groups = [[0, 1, 2, 3], [4, 5, 6, 7]];
    const frag = evaluateMapping(m, beadsFrom(groups));
    const atoms = evaluateMapping(m, { ...beadsFrom(groups), partitionBasis: 'atoms' });
    expect(frag.partitionBasis).toBe('fragment');
    expect(frag.beads[1].partitionSource).toBe('fragment');
    expect(frag.beads[1].partitionDeltaG).toBeCloseTo(frag.beads[1].fragmentDeltaG!, 12);
    expect(atoms.beads[1].partitionSource).toBe('atoms');
    expect(atoms.beads[1].partitionDeltaG).toBeCloseTo(atoms.beads[1].deltaG!, 12);
    const measured = beadsFrom(groups);
    measured.beads[1].measured = { kind: 'deltaG', value: -20, source: 'our own shake-flask run' };
    const mv = evaluateMapping(m, measured, { temperature: 310 });
    // A ΔG is read at 298.15 K: logP = −20 / 5.70803 = −3.5038; at 310 K, ΔG = −20 · 310 / 298.15.
    expect(mv.beads[1].measuredLogP).toBeCloseTo(-3.5038, 4);
    expect(mv.beads[1].measuredDeltaG).toBeCloseTo((-20 * 310) / 298.15, 9);
    expect([mv.beads[1].partitionSource, mv.beads[1].measuredSource]).toEqual(['measured', 'our own shake-flask run']);
    expect(mv.beads[1].suggestedType).toBe('water-loving 3, 4 atoms');
  });

  it('ΔG(T) scales logP linearly; the inverse gives the logP back', () => {
    expect(partitionFreeEnergy(1, 596.3) / partitionFreeEnergy(1, 298.15)).toBeCloseTo(2, 12);
    expect(logPFromFreeEnergy(partitionFreeEnergy(-1.25))).toBeCloseTo(-1.25, 12);
  });
});
