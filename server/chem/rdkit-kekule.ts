/**
 * RDKit's Kekulé structure for aromatic SMILES that openchemlib cannot kekulize.
 *
 * openchemlib gives up on some aromatic systems that are fine chemistry (porphine, tetraphenyl-
 * porphyrin, chlorin, corrole: large conjugated macrocycles with [nH]) by leaving a radical on a ring
 * atom, and it does not know aromatic tellurium (`[te]`, an RDKit extension of OpenSMILES). RDKit reads
 * these; its molfile (V3000, explicit alternating bond orders, atoms in the order of the SMILES) is then
 * read by openchemlib, which perceives aromaticity again from the Kekulé form. Returns null when RDKit
 * cannot read the SMILES either (or is not loaded; parseMolecule loads it first).
 */
import { rdkitIfLoaded } from './rdkit';

export function kekulizeWithRdkit(smiles: string): string | null {
  const rd = rdkitIfLoaded();
  if (!rd) return null;
  const mol = rd.get_mol(smiles);
  if (!mol) return null;
  try {
    // 2D coordinates, so that openchemlib reads the ring double bonds' geometry from a drawing rather
    // than from atoms all at the origin.
    mol.set_new_coords();
    return mol.get_v3Kmolblock(JSON.stringify({ kekulize: true }));
  } finally {
    mol.delete();
  }
}
