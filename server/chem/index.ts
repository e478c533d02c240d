/**
 * The chemistry core's public contract. Pure: no HTTP, no database, no file or network I/O of its own
 * (RDKit's WebAssembly and openchemlib's conformer tables load from node_modules on first use).
 */
export { parseMolecule } from './molecule';
export { ChemError, isChemError, LIMITS } from './errors';
export { loadRdkit } from './rdkit';
export type { MoleculeInput } from './parse';
