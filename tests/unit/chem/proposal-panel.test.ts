/**
 * Quality of the mapping proposals (server/chem/propose.ts) on a panel of 290 molecules
 * (fixtures/proposal-panel.ts): surfactants, lipids, dyes, drugs, sugars, amino acids, polymer repeat
 * units, salts and small molecules. Targets (issue: mapping proposals): no error-level check; ≥ 95 % of
 * beads within the resolution's size limits (resolution.ts, common practice, no source); no charged
 * group (checks.ts) and no listed functional group split; symmetry-equivalent atoms in beads of the
 * same composition; the same answer on a repeated run and for the same molecule written with another
 * atom order.
 *
 * Outside references: RDKit (@rdkit/rdkit) finds the listed functional groups by SMARTS, finds the
 * molecule's automorphisms (the molecule matched onto itself, all matches), from which the
 * symmetry-equivalent atoms follow independently of our own symmetry classes, and writes each
 * molecule as a randomised SMILES (another atom order) for the order test.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { evaluateMapping, loadRdkit, parseMolecule, type Mapping, type Molecule, type Resolution } from '../../../server/chem/index';
import { isFreeIon } from '../../../server/chem/free-ions';
import { writeTypingMolfile } from '../../../server/chem/molfile';
import { prepare } from '../../../server/chem/prepared';
import { proposePartitions, type ProposedPartition } from '../../../server/chem/propose';
import { asymmetricClasses, compositionOf } from '../../../server/chem/propose-cost';
import { symmetryClasses } from '../../../server/chem/propose-symmetry';
import type { RDKit } from '../../../server/chem/rdkit';
import { RESOLUTION_LIMITS } from '../../../server/chem/resolution';
import { proposedAtoms } from '../../../src/shared/proposals';
import { PROPOSAL_PANEL } from './fixtures/proposal-panel';

/** Listed groups (docs/chemistry.md, "Mapping proposals"): SMARTS and how many leading atoms must stay together. */
const LISTED: { name: string; smarts: string; atoms: number }[] = [
  { name: 'carboxylic acid / carboxylate', smarts: '[CX3](=O)[OX2H1,OX1-]', atoms: 3 },
  { name: 'ester', smarts: '[CX3](=O)[OX2][#6]', atoms: 3 },
  { name: 'amide (not an imide N)', smarts: '[CX3](=O)[NX3;!$(N([CX3]=O)[CX3]=O)]', atoms: 3 },
  { name: 'sulfonate / sulfate / sulfonic acid', smarts: '[SX4](=O)(=O)[OX1-,OX2H1]', atoms: 4 },
  { name: 'sulfonyl / phosphoryl with terminal O', smarts: '[SX4,PX4]~[OX1]', atoms: 2 },
  { name: 'nitro', smarts: '[NX3](~[OX1])~[OX1]', atoms: 3 },
  { name: 'nitrile', smarts: 'C#N', atoms: 2 },
];

interface Entry {
  name: string;
  molecule: Molecule;
  orbitOf: Int32Array;
  groups: { name: string; atoms: number[] }[];
}

let rd: RDKit;
const entries: Entry[] = [];

function toMapping(p: ProposedPartition): Mapping {
  return { beads: p.beads.map((b, i) => ({ id: `p${i}`, name: `B${i + 1}`, centre: 'mass', atoms: proposedAtoms(b) })) };
}

/** Orbits of the automorphism group, from RDKit matching the molecule onto itself (every match). */
function orbits(molfile: string, n: number): Int32Array {
  const mol = rd.get_mol(molfile, JSON.stringify({ removeHs: false }))!;
  const parent = Int32Array.from({ length: n }, (_, i) => i);
  const find = (i: number): number => (parent[i] === i ? i : (parent[i] = find(parent[i])));
  try {
    const found = JSON.parse(mol.get_substruct_matches(mol, JSON.stringify({ uniquify: false, maxMatches: 100_000 }))) as { atoms: number[] }[];
    for (const { atoms } of found) atoms.forEach((image, a) => (parent[find(a)] = find(image)));
  } finally {
    mol.delete();
  }
  return Int32Array.from({ length: n }, (_, i) => find(i));
}

function listedGroups(molfile: string): { name: string; atoms: number[] }[] {
  const mol = rd.get_mol(molfile, JSON.stringify({ removeHs: false }))!;
  const out: { name: string; atoms: number[] }[] = [];
  try {
    for (const g of LISTED) {
      const q = rd.get_qmol(g.smarts)!;
      const found = JSON.parse(mol.get_substruct_matches(q)) as { atoms: number[] }[] | Record<string, never>;
      if (Array.isArray(found)) for (const m of found) out.push({ name: g.name, atoms: m.atoms.slice(0, g.atoms) });
      q.delete();
    }
  } finally {
    mol.delete();
  }
  return out;
}

beforeAll(async () => {
  rd = await loadRdkit();
  for (const { name, smiles } of PROPOSAL_PANEL) {
    const molecule = await parseMolecule({ smiles });
    const molfile = writeTypingMolfile(molecule);
    entries.push({ name, molecule, orbitOf: orbits(molfile, molecule.atoms.length), groups: listedGroups(molfile) });
  }
}, 120_000);

interface Tally {
  beads: number;
  inside: number;
  problems: string[];
}

function assess(resolution: Resolution): Tally {
  const limits = RESOLUTION_LIMITS[resolution];
  const tally: Tally = { beads: 0, inside: 0, problems: [] };
  for (const { name, molecule, orbitOf, groups } of entries) {
    const [best] = proposePartitions(molecule, { resolution });
    const p = prepare(molecule);
    const evaluation = evaluateMapping(molecule, toMapping(best), { resolution, fragments: false });
    const bad = evaluation.checks.filter((c) => c.severity === 'error' || ['split_charged_group', 'disconnected_bead', 'unassigned_atom', 'weight_sum_below_one'].includes(c.code));
    if (bad.length) tally.problems.push(`${name}: ${bad.map((c) => c.code).join(', ')}`);
    // Every heavy atom's weights over the proposal add up to 1 (shared atoms split between beads).
    const sum = new Map<number, number>();
    for (const b of best.beads) for (const { index, weight } of proposedAtoms(b)) sum.set(index, (sum.get(index) ?? 0) + weight);
    const badSum = [...sum].filter(([, w]) => Math.abs(w - 1) > 1e-9);
    if (badSum.length || sum.size !== p.heavy.reduce((s, h) => s + h, 0)) tally.problems.push(`${name}: weights do not sum to 1 on every heavy atom`);
    // A listed group is split when its atoms are not all wholly in one and the same bead.
    const holders = new Map<number, { bead: number; weight: number }[]>();
    best.beads.forEach((b, i) => proposedAtoms(b).forEach(({ index, weight }) => holders.set(index, [...(holders.get(index) ?? []), { bead: i, weight }])));
    const wholeIn = (a: number) => { const h = holders.get(a) ?? []; return h.length === 1 && h[0].weight === 1 ? h[0].bead : -1; };
    for (const g of groups) if (wholeIn(g.atoms[0]) < 0 || g.atoms.some((a) => wholeIn(a) !== wholeIn(g.atoms[0]))) tally.problems.push(`${name}: ${g.name} split (atoms ${g.atoms.join(', ')})`);
    // Symmetry against RDKit's automorphism orbits; with shared atoms each atom's place (bead
    // compositions and its own weights) must agree across its orbit.
    if (asymmetricClasses(best.beads.map((b) => b.atoms), orbitOf, best.beads.map((b) => b.weights)).length) tally.problems.push(`${name}: not symmetric`);
    for (const b of best.beads) {
      if (b.atoms.every((a) => isFreeIon(molecule, p, a))) continue;
      tally.beads++;
      // Shared atoms count with their weight (resolution.ts).
      const size = b.weights ? b.weights.reduce((s, w) => s + w, 0) : b.atoms.length;
      if (size >= limits.min - 1e-9 && size <= limits.max + 1e-9) tally.inside++;
    }
  }
  return tally;
}

describe('mapping proposals on the panel', () => {
  it('has at least 200 distinct molecules of every kind', () => {
    expect(new Set(PROPOSAL_PANEL.map((m) => m.smiles)).size).toBeGreaterThanOrEqual(200);
    for (const g of ['surfactant', 'lipid', 'dye', 'drug', 'sugar', 'amino-acid', 'polymer', 'salt']) expect(PROPOSAL_PANEL.some((m) => m.group === g), g).toBe(true);
  });

  it.each(['4:1', '3:1', '2:1'] as const)('at %s: no error-level check, no split group, every molecule symmetric, at least 95 percent of beads within limits', (resolution) => {
    const t = assess(resolution);
    expect(t.problems).toEqual([]);
    expect(t.inside / t.beads).toBeGreaterThanOrEqual(0.95);
    console.log(`proposal panel ${resolution}: ${t.inside} of ${t.beads} beads within limits (${((100 * t.inside) / t.beads).toFixed(1)} %)`);
  });

  it('gives the same proposals on a repeated run and for the molecule written with another atom order', async () => {
    const differ: string[] = [];
    const signature = (m: Molecule, list: ProposedPartition[]) => {
      const classes = symmetryClasses(m, prepare(m));
      return list.map((p) => `${p.cost}:${p.beads.map((b) => compositionOf(b.atoms, classes)).sort().join('|')}`);
    };
    for (const [k, { name, molecule }] of entries.entries()) {
      const first = proposePartitions(molecule, { resolution: '4:1' });
      expect(proposePartitions(molecule, { resolution: '4:1' })).toEqual(first);
      const mol = rd.get_mol(writeTypingMolfile(molecule))!;
      const shuffled = mol.get_smiles(JSON.stringify({ doRandom: true, randomSeed: 17 + k, canonical: false }));
      mol.delete();
      const other = await parseMolecule({ smiles: shuffled });
      if (JSON.stringify(signature(other, proposePartitions(other, { resolution: '4:1' }))) !== JSON.stringify(signature(molecule, first))) differ.push(`${name} (${shuffled})`);
    }
    expect(differ).toEqual([]);
  }, 120_000);
});
