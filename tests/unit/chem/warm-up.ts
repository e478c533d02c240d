import { beforeAll } from 'vitest';
import { parseMolecule } from '../../../server/chem/index';

/**
 * The first parse in a worker pays openchemlib's and RDKit's one-off start-up (seconds on a loaded
 * machine); pay it in a hook with room to spare so no single test inherits it.
 */
export function warmUpChemistry(): void {
  beforeAll(async () => {
    await parseMolecule({ smiles: 'c1ccccc1CCO' });
  }, 60_000);
}
