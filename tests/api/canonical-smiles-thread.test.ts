import { afterAll, describe, expect, it } from 'vitest';
import { parseMolecule, loadRdkit } from '../../server/chem/index';
import { parseInThread, stopParseThread } from '../../server/workers/parse-thread';
import { SPLIT_FROM } from '../../server/workers/canonical-smiles-thread';

// The parse thread hands a large structure's canonical SMILES to a second thread (issue 13, parse speed).
// What a user gets must not depend on that: the same canonical SMILES as parsing in one thread, and
// the same refusal for a structure that cannot be read.

/** Our own test polymer (as in bench/chem.ts): styrene, acrylic acid and ethylene-oxide units. */
const polymer = (units: number) => 'C' + 'CC(c1ccccc1)CC(C(=O)O)COCCO'.repeat(units) + 'C';

afterAll(() => stopParseThread());

describe('canonical SMILES from the second thread', () => {
  it('equals the one-thread parse for a large SMILES, a reordered copy of it and a large molfile', async () => {
    await loadRdkit();
    const big = polymer(40) + '.[Na+].[Cl-]';
    expect(big.length).toBeGreaterThanOrEqual(SPLIT_FROM.smilesLength);
    const threaded = await parseInThread({ smiles: big });
    const local = await parseMolecule({ smiles: big });
    expect(threaded.canonicalSmiles).toBe(local.canonicalSmiles);
    expect(threaded.atoms).toEqual(local.atoms);
    // The same molecule written from the other end: canonical means the same string.
    const reversed = '[Cl-].[Na+].' + 'C' + 'OCCOCC(C(=O)O)CC(c1ccccc1)C'.repeat(40) + 'C';
    expect((await parseInThread({ smiles: reversed })).canonicalSmiles).toBe(local.canonicalSmiles);

    const rd = await loadRdkit();
    const mol = rd.get_mol(polymer(30))!;
    const molfile = mol.get_molblock();
    mol.delete();
    const molfileLocal = await parseMolecule({ molfile: molfile.padEnd(SPLIT_FROM.molfileLength + 10, '\n') });
    const molfileThreaded = await parseInThread({ molfile: molfile.padEnd(SPLIT_FROM.molfileLength + 10, '\n') });
    expect(molfileThreaded.canonicalSmiles).toBe(molfileLocal.canonicalSmiles);
  });

  it('refuses a large structure with the parse error, not a thread failure', async () => {
    const bad = polymer(40) + 'C(C)(C)(C)(C)C'; // a carbon with five neighbours
    await expect(parseInThread({ smiles: bad })).rejects.toMatchObject({ code: 'valence_error' });
  });
});
