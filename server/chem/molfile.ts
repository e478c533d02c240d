/**
 * Canonical model → MDL V3000 molfile for RDKit atom typing.
 *
 * Molfile atom k+1 is model atom k, so RDKit sees exactly our atoms in our order. Hydrogens stay
 * implicit but are fixed: every atom carries VAL= (its total bond order with its hydrogens counted), so
 * RDKit gives it exactly our hydrogen count and computes none of its own. Bond orders are openchemlib's
 * Kekulé orders; RDKit perceives aromaticity itself. Zero-order (metal–ligand) bonds are left out.
 * Coordinates are zero: typing needs none. Format: BIOVIA "CTfile Formats" (V3000 connection table).
 */
import type { Atom, Bond } from '../../src/shared/chem';

export interface TypingInput {
  atoms: Atom[];
  bonds: Bond[];
}

export function writeTypingMolfile({ atoms, bonds }: TypingInput): string {
  const valence = atoms.map((a) => a.hydrogens);
  const kept = bonds.filter((b) => b.order > 0);
  for (const b of kept) {
    valence[b.a] += b.order;
    valence[b.b] += b.order;
  }
  const atomLines = atoms.map((a, i) => {
    let line = `M  V30 ${i + 1} ${a.element} 0 0 0 0`;
    if (a.charge !== 0) line += ` CHG=${a.charge}`;
    if (a.isotope !== null) line += ` MASS=${a.isotope}`;
    if (a.radical > 0) line += ` RAD=${a.radical === 1 ? 2 : 3}`;
    return `${line} VAL=${valence[i] === 0 ? -1 : valence[i]}`;
  });
  const bondLines = kept.map((b, i) => `M  V30 ${i + 1} ${b.order} ${b.a + 1} ${b.b + 1}`);
  return [
    '',
    '  Beadloom',
    '',
    '  0  0  0     0  0            999 V3000',
    'M  V30 BEGIN CTAB',
    `M  V30 COUNTS ${atomLines.length} ${bondLines.length} 0 0 0`,
    'M  V30 BEGIN ATOM',
    ...atomLines,
    'M  V30 END ATOM',
    ...(bondLines.length ? ['M  V30 BEGIN BOND', ...bondLines, 'M  V30 END BOND'] : []),
    'M  V30 END CTAB',
    'M  END',
    '',
  ].join('\n');
}
