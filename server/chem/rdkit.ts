/**
 * Lazy, process-wide RDKit (MinimalLib WebAssembly) loader.
 *
 * RDKit is used for one job only: SMARTS matching of the Wildman–Crippen atom types, which openchemlib's
 * SMARTS cannot express. The module loads once (~0.2 s, from node_modules, no network); compiled query
 * molecules are kept for the life of the process.
 */
import initRDKitModule from '@rdkit/rdkit';
import type { MainModule, Mol } from '@rdkit/rdkit';

export type RDKit = MainModule;
export type RDKitMol = Mol;

let loading: Promise<RDKit> | null = null;
let loaded: RDKit | null = null;

export function loadRdkit(): Promise<RDKit> {
  loading ??= initRDKitModule().then((rd) => {
    rd.disable_logging();
    loaded = rd;
    return rd;
  });
  return loading;
}

/** The module if `loadRdkit()` has finished, else null (synchronous callers use this). */
export function rdkitIfLoaded(): RDKit | null {
  return loaded;
}
