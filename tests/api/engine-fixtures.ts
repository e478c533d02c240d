import type { Db } from '../../server/db/knex';
import type { Molecule, Vec3 } from '../../src/shared/chem';
import type { BondedTerm } from '../../src/shared/bonded-terms';
import { demoProjectId } from '../helpers/fixtures';

// Invented molecules for the engine tests, mapped by their structure (openchemlib's atom order need not
// follow the SMILES), with 3D coordinates from the app's own conformer generator (seed 1).

export interface Fixture {
  moleculeId: number;
  mappingId: number;
  model: Molecule;
}

/** A molecule with a conformer, and a mapping of the given beads (atom index lists) and bead types. */
export async function mappedMolecule(db: Db, name: string, smiles: string, beadsOf: (m: Molecule) => { name: string; type: string; atoms: number[] }[]): Promise<Fixture> {
  const { parseMolecule } = await import('../../server/chem/index');
  const { generateConformer } = await import('../../server/chem/conformer');
  const { insertMolecule, setXyz } = await import('../../server/molecules/molecules.service');
  const { createMapping } = await import('../../server/mappings/mappings.service');
  const model = await parseMolecule({ smiles });
  const moleculeId = await insertMolecule(db, { projectId: await demoProjectId(db), userId: null, name, source: 'smiles', smiles, model });
  await setXyz(db, moleculeId, await generateConformer(model, { seed: 1 }), 'conformer');
  const beads = beadsOf(model).map((b, i) => ({ id: `b${i}`, name: b.name, type: b.type, centre: 'mass' as const, atoms: b.atoms.map((index) => ({ index, weight: 1 })) }));
  const mappingId = await createMapping(db, moleculeId, { name: `${name} CG`, resolution: '4:1' }, null as unknown as number, { beads });
  return { moleculeId, mappingId, model };
}

const neighbours = (m: Molecule, a: number) => m.bonds.flatMap((b) => (b.a === a ? [b.b] : b.b === a ? [b.a] : []));

/** Heavy atoms of an unbranched chain from one end, starting at the end with the given element. */
export function chainOrder(m: Molecule, startElement: string, within: (a: number) => boolean = () => true): number[] {
  const ends = m.atoms.filter((a) => a.element === startElement && within(a.index) && neighbours(m, a.index).filter(within).length === 1);
  const order = [ends[0].index];
  for (;;) {
    const next = neighbours(m, order[order.length - 1]).filter((n) => within(n) && !order.includes(n));
    if (next.length === 0) return order;
    order.push(next[0]);
  }
}

/** The atoms of the (single) six-ring, in ring order. */
export function ringOrder(m: Molecule): number[] {
  const aromatic = new Set(m.atoms.filter((a) => a.aromatic).map((a) => a.index));
  const start = [...aromatic][0];
  const order = [start];
  for (;;) {
    const next = neighbours(m, order[order.length - 1]).filter((n) => aromatic.has(n) && !order.includes(n));
    if (next.length === 0) return order;
    order.push(next[0]);
  }
}

export { neighbours };

const sub = (a: Vec3, b: Vec3): Vec3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const dot = (a: Vec3, b: Vec3) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const norm = (a: Vec3) => Math.sqrt(dot(a, a));

/**
 * Bonded terms at the geometry of the bead centres (Å): bond lengths and angles as they are, so the
 * exported model starts at rest; force constants are test values (no source), dihedrals weak.
 */
export function termsAtGeometry(rows: BondedTerm[], centre: (name: string) => Vec3, options: { constrain?: (t: BondedTerm) => boolean; omit?: (t: BondedTerm) => boolean } = {}): BondedTerm[] {
  return rows.map((t) => {
    const p = t.beads.map(centre);
    if (t.kind === 'bond') {
      const constraint = options.constrain?.(t) ?? false;
      return { ...t, function: 'harmonic', value: Number((norm(sub(p[0], p[1])) / 10).toFixed(4)), k: constraint ? null : 5000, ...(constraint ? { constraint: true } : {}) };
    }
    if (options.omit?.(t)) return { ...t, omit: true };
    if (t.kind === 'angle') {
      const u = sub(p[0], p[1]);
      const v = sub(p[2], p[1]);
      const theta = (Math.acos(Math.max(-1, Math.min(1, dot(u, v) / (norm(u) * norm(v))))) * 180) / Math.PI;
      return { ...t, function: 'harmonic', value: Number(theta.toFixed(2)), k: 50 };
    }
    return { ...t, function: 'periodic', value: 0, k: 1, multiplicity: 1 };
  });
}
