/**
 * Proposed beads that share atoms (server/chem/propose-mapping.ts): the served bead keeps its weights,
 * and the mapping evaluated for its type suggestion counts each shared atom by its weight.
 *
 * Adamantane C10H16 as four beads, each a CH bridgehead (weight 1) and its three CH2 neighbours at 0.5
 * (hand-worked: every CH2 lies between two bridgeheads, so 0.5 + 0.5 = 1 per atom). Masses from
 * CIAAW's conventional atomic weights C 12.011, H 1.008 (2021 table, server/chem/atomic-weights.ts):
 * CH 13.019, CH2 14.027, so a bead is 13.019 + 1.5 × 14.027 = 34.0595 and the four 136.238, the molar
 * mass of C10H16 (10 × 12.011 + 16 × 1.008).
 */
import { describe, expect, it } from 'vitest';
import { evaluateMapping, parseMolecule } from '../../../server/chem/index';
import type { ProposedPartition } from '../../../server/chem/propose';
import { partitionMapping, servedProposal } from '../../../server/chem/propose-mapping';
import { warmUpChemistry } from './warm-up';

warmUpChemistry();

const ADAMANTANE = 'C1C2CC3CC1CC(C2)C3';

async function adamantane() {
  const molecule = await parseMolecule({ smiles: ADAMANTANE });
  const neighbours = (i: number) => molecule.bonds.flatMap((x) => (x.a === i ? [x.b] : x.b === i ? [x.a] : []));
  const heads = molecule.atoms.map((_x, a) => a).filter((a) => neighbours(a).length === 3);
  const partition: ProposedPartition = {
    beads: heads.map((h) => {
      const atoms = [h, ...neighbours(h)].sort((x, y) => x - y);
      return { atoms, weights: atoms.map((a) => (a === h ? 1 : 0.5)), reason: 'bridgehead with its CH2 neighbours' };
    }),
    cost: 0,
  };
  return { molecule, partition, heads };
}

describe('proposed beads that share atoms', () => {
  it('are evaluated with their weights, so each bead has its share of the mass', async () => {
    const { molecule, partition, heads } = await adamantane();
    expect(heads).toHaveLength(4);
    const evaluation = evaluateMapping(molecule, partitionMapping(partition, ['B1', 'B2', 'B3', 'B4']), { resolution: '4:1' });
    for (const b of evaluation.beads) expect(b.mass).toBeCloseTo(34.0595, 3);
    expect(evaluation.beads.reduce((s, b) => s + b.mass, 0)).toBeCloseTo(136.238, 3);
  });

  it('are served with their weights and the type suggested for the weighted bead', async () => {
    const { molecule, partition } = await adamantane();
    const served = servedProposal(molecule, partition, new Set(['B1']), { resolution: '4:1', draft: { beads: [] } });
    expect(served.beads.map((b) => b.name)).toEqual(['B2', 'B3', 'B4', 'B5']);
    expect(served.beads.map((b) => [b.atoms, b.weights])).toEqual(partition.beads.map((b) => [b.atoms, b.weights]));
    const evaluation = evaluateMapping(molecule, partitionMapping(partition, ['B2', 'B3', 'B4', 'B5']), { resolution: '4:1' });
    expect(served.beads.map((b) => b.type)).toEqual(evaluation.beads.map((b) => b.suggestedType));
    // Every atom's weights over the proposal sum to 1.
    const sums = new Map<number, number>();
    for (const b of served.beads) b.atoms.forEach((a, k) => sums.set(a, (sums.get(a) ?? 0) + (b.weights?.[k] ?? 1)));
    expect([...sums.values()].every((s) => Math.abs(s - 1) < 1e-9)).toBe(true);
    expect(sums.size).toBe(10);
  });

  it('without weights are served without the field', async () => {
    const molecule = await parseMolecule({ smiles: 'CCCCCC' });
    const served = servedProposal(molecule, { beads: [{ atoms: [0, 1, 2], reason: '' }, { atoms: [3, 4, 5], reason: '' }], cost: 0 }, new Set(), { resolution: '4:1', draft: { beads: [] } });
    expect(served.beads.every((b) => !('weights' in b))).toBe(true);
  });
});
