/**
 * The chemistry core's public contract. Pure: no HTTP, no database, no file or network I/O of its own
 * (RDKit's WebAssembly and openchemlib's conformer tables load from node_modules on first use).
 */
export { parseMolecule } from './molecule';
export { evaluateMapping } from './evaluate';
export { generateConformer, type ConformerOptions } from './conformer';
export { ChemError, isChemError, LIMITS } from './errors';
export { loadRdkit } from './rdkit';
export { DEMO_LIBRARY } from './demo-library';
export { partitionFreeEnergy, GAS_CONSTANT, DEFAULT_TEMPERATURE } from './partition';
export { STANDARD_ATOMIC_WEIGHTS } from './atomic-weights';
export type { MoleculeInput } from './parse';
export type * from '../../src/shared/chem';
