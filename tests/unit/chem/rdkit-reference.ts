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
