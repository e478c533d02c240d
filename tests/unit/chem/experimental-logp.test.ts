/**
 * Wildman–Crippen logP against measured octanol/water logP of simple compounds. A sanity check that
 * the method is applied sensibly, not an exactness claim (the method's own published error is about
 * 0.7 log units over a broad set).
 *
 * Source: C. Hansch, A. Leo, D. Hoekman, "Exploring QSAR: Hydrophobic, Electronic, and Steric
 * Constants", ACS Professional Reference Book, 1995 (recommended log P values). ALL values below are
 * from memory of that compilation, not re-read from the book for this test.
 */
import { describe, expect, it } from 'vitest';
import { warmUpChemistry } from './warm-up';
import { parseMolecule } from '../../../server/chem/index';

const MEASURED: [string, string, number][] = [
  ['methanol', 'CO', -0.77],
  ['ethanol', 'CCO', -0.31],
  ['1-propanol', 'CCCO', 0.25],
  ['1-butanol', 'CCCCO', 0.88],
  ['1-octanol', 'CCCCCCCCO', 3.0],
  ['acetic acid', 'CC(=O)O', -0.17],
  ['acetone', 'CC(C)=O', -0.24],
  ['diethyl ether', 'CCOCC', 0.89],
  ['ethyl acetate', 'CCOC(C)=O', 0.73],
  ['n-hexane', 'CCCCCC', 3.9],
  ['cyclohexane', 'C1CCCCC1', 3.44],
  ['benzene', 'c1ccccc1', 2.13],
  ['toluene', 'Cc1ccccc1', 2.73],
  ['phenol', 'Oc1ccccc1', 1.46],
  ['aniline', 'Nc1ccccc1', 0.9],
  ['chlorobenzene', 'Clc1ccccc1', 2.84],
  ['bromobenzene', 'Brc1ccccc1', 2.99],
  ['nitrobenzene', '[O-][N+](=O)c1ccccc1', 1.85],
  ['benzoic acid', 'OC(=O)c1ccccc1', 1.87],
  ['anisole', 'COc1ccccc1', 2.11],
  ['pyridine', 'c1ccncc1', 0.65],
  ['naphthalene', 'c1ccc2ccccc2c1', 3.3],
  ['chloroform', 'ClC(Cl)Cl', 1.97],
  ['tetrachloromethane', 'ClC(Cl)(Cl)Cl', 2.83],
];


warmUpChemistry();
describe('logP against measured values (Hansch, Leo & Hoekman 1995)', () => {
  it('mean absolute error below 0.5 over at least 15 compounds', async () => {
    const rows: string[] = [];
    let sum = 0;
    for (const [name, smiles, measured] of MEASURED) {
      const { logP } = await parseMolecule({ smiles });
      sum += Math.abs(logP - measured);
      rows.push(`${name}: calc ${logP.toFixed(2)} exp ${measured.toFixed(2)}`);
    }
    const mae = sum / MEASURED.length;
    console.info(`experimental logP: n=${MEASURED.length}, MAE ${mae.toFixed(3)}\n${rows.join('\n')}`);
    expect(MEASURED.length).toBeGreaterThanOrEqual(15);
    expect(mae).toBeLessThan(0.5);
  });
});
