import { atomMass } from '../../../server/chem/atomic-weights';
import type { Molecule } from '../../../src/shared/chem';
import type { RDKit } from '../../../server/chem/rdkit';

/** RDKit's own Crippen logP and average molecular weight for a SMILES it parses itself. */
export function rdkitReference(rd: RDKit, smiles: string): { clogp: number; amw: number } {
  const mol = rd.get_mol(smiles);
  if (!mol) throw new Error(`RDKit cannot read ${smiles}`);
  try {
    const d = JSON.parse(mol.get_descriptors()) as { CrippenClogP: number; amw: number };
    return { clogp: d.CrippenClogP, amw: d.amw };
  } finally {
    mol.delete();
  }
}

/** RDKit's own weight for an element or isotope, read from RDKit (a bare bracket atom has no hydrogens). */
const rdWeights = new Map<string, number>();
export function rdkitElementWeight(rd: RDKit, element: string, isotope: number | null): number {
  const key = `${isotope ?? ''}${element}`;
  if (!rdWeights.has(key)) rdWeights.set(key, rdkitReference(rd, `[${key}]`).amw);
  return rdWeights.get(key)!;
}

/** amw − Σ_element count × (RDKit's weight − CIAAW 2021 weight): RDKit's mass on our atomic weights. */
export function rdkitAmwOnCiaaw(rd: RDKit, m: Molecule, amw: number): number {
  let correction = 0;
  const add = (el: string, iso: number | null): void => {
    correction += rdkitElementWeight(rd, el, iso) - atomMass(el, iso);
  };
  for (const a of m.atoms) {
    add(a.element, a.isotope);
    for (let k = 0; k < a.hydrogens - a.hydrogenIsotopes.length; k++) add('H', null);
    for (const iso of a.hydrogenIsotopes) add('H', iso);
  }
  return amw - correction;
}
