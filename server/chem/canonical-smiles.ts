/**
 * The canonical SMILES of a parsed structure: openchemlib's isomeric SMILES, with the attachment-point
 * placeholder written back as `*` (parse.ts). Canonicalisation is the slowest step of parsing a large
 * molecule (about 1.4 s of 2 s at 2,000 heavy atoms), and it needs nothing the rest of the parse
 * computes, so `canonicalSmilesOf` lets a second thread do it from the same input meanwhile
 * (server/workers/canonical-smiles-thread.ts). Both paths call `canonicalSmiles`, so they agree.
 */
import { parseInput, type MoleculeInput, type OclMolecule } from './parse';

export function canonicalSmiles(mol: OclMolecule): string {
  return mol.toIsomericSmiles().replace(/\[Rf\]/g, '*');
}

/** Parses `input` exactly as parseMolecule does and returns its canonical SMILES. */
export function canonicalSmilesOf(input: MoleculeInput): string {
  return canonicalSmiles(parseInput(input).mol);
}
