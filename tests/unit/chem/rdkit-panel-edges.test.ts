/**
 * The RDKit panel's edge cases (fixtures/rdkit-panel-edges.ts): salts, zwitterions, dyes, macrocycles,
 * repeat units with `*`, ions. RDKit (@rdkit/rdkit MinimalLib) reads each SMILES itself; Beadloom must
 * accept every one RDKit reads, except the documented refusals, and agree on Crippen logP (RDKit
 * CrippenClogP) and molecular weight (RDKit's amw moved onto CIAAW 2021 weights).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { ChemError, loadRdkit, parseMolecule } from '../../../server/chem/index';
import type { RDKit } from '../../../server/chem/rdkit';
import { DOCUMENTED_REFUSALS, EDGE_PANEL } from './fixtures/rdkit-panel-edges';
import { PANEL } from './fixtures/rdkit-panel';
import { rdkitAmwOnCiaaw, rdkitReference } from './rdkit-reference';
import { warmUpChemistry } from './warm-up';

warmUpChemistry();
let rd: RDKit;
beforeAll(async () => {
  rd = await loadRdkit();
});

describe('RDKit panel: edge cases', () => {
  it('holds at least 100 new distinct molecules over salts, zwitterions, dyes, macrocycles, repeat units and ions', () => {
    const smiles = new Set(EDGE_PANEL.map((p) => p.smiles));
    expect(smiles.size).toBe(EDGE_PANEL.length);
    const old = new Set(PANEL.map((p) => p.smiles));
    expect([...smiles].filter((s) => !old.has(s)).length).toBeGreaterThanOrEqual(100);
    for (const g of ['salt', 'zwitterion', 'dye', 'macrocycle', 'repeat-unit', 'ion']) expect(EDGE_PANEL.some((p) => p.group === g), g).toBe(true);
  });

  it('accepts every SMILES RDKit reads and matches its logP within 0.01 and weight within 0.01', async () => {
    let rdkitReads = 0;
    let accepted = 0;
    const refused: string[] = [];
    const misses: string[] = [];
    let maxLogP = 0;
    let maxMw = 0;
    for (const { smiles } of EDGE_PANEL) {
      const mol = rd.get_mol(smiles);
      if (!mol) continue;
      mol.delete();
      rdkitReads++;
      let m;
      try {
        m = await parseMolecule({ smiles });
      } catch (e) {
        refused.push(`${smiles}: ${e instanceof ChemError ? e.code : String(e)}`);
        continue;
      }
      accepted++;
      const ref = rdkitReference(rd, smiles);
      const dLogP = Math.abs(m.logP - ref.clogp);
      const dMw = Math.abs(m.molecularWeight - rdkitAmwOnCiaaw(rd, m, ref.amw));
      maxLogP = Math.max(maxLogP, dLogP);
      maxMw = Math.max(maxMw, dMw);
      if (dLogP > 0.01 || dMw > 0.01) misses.push(`${smiles}: logP ${m.logP.toFixed(4)} vs ${ref.clogp.toFixed(4)}, MW ${m.molecularWeight.toFixed(4)}`);
    }
    console.info(
      `RDKit edge panel: ${EDGE_PANEL.length} molecules, RDKit reads ${rdkitReads}, Beadloom accepts ${accepted} ` +
        `(${((100 * accepted) / rdkitReads).toFixed(1)}%); max |ΔlogP| ${maxLogP.toExponential(2)}, max |ΔMW| ${maxMw.toExponential(2)}`,
    );
    expect(rdkitReads).toBe(EDGE_PANEL.length);
    expect(refused).toEqual([]);
    expect(misses).toEqual([]);
  }, 180_000);

  it.each(DOCUMENTED_REFUSALS)('refuses $smiles on purpose ($code): $why', async ({ smiles, code }) => {
    const mol = rd.get_mol(smiles);
    expect(mol, 'RDKit reads it').not.toBeNull();
    mol?.delete();
    await expect(parseMolecule({ smiles })).rejects.toMatchObject({ code });
  });
});
