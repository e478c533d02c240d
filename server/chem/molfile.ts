/**
 * Canonical model → MDL V3000 molfile with every hydrogen as an atom of its own.
 *
 * This is what RDKit reads for atom typing, so that RDKit sees exactly our atoms in our order: the
 * heavy atoms first (molfile atom k+1 = model atom k), then the hydrogens grouped by parent in the
 * contract's order. Every atom carries VAL= (its total bond order, hydrogens included) so that RDKit
 * adds no implicit hydrogens of its own. Bond orders are openchemlib's Kekulé orders; RDKit perceives
 * aromaticity itself. Zero-order (metal–ligand) bonds are left out. Coordinates are zero: typing needs
 * none. Format: BIOVIA "CTfile Formats" (V3000 connection table).
 */
import type { Atom, Bond } from '../../src/shared/chem';

export interface TypingInput {
  atoms: Atom[];
  bonds: Bond[];
}

export function hydrogenCount(atoms: Atom[]): number {
  let n = 0;
  for (const a of atoms) n += a.hydrogens;
  return n;
}

export function writeTypingMolfile({ atoms, bonds }: TypingInput): string {
  const valence = atoms.map((a) => a.hydrogens);
  const kept = bonds.filter((b) => b.order > 0);
  for (const b of kept) {
    valence[b.a] += b.order;
    valence[b.b] += b.order;
  }
  const atomLines: string[] = [];
  atoms.forEach((a, i) => {
    let line = `M  V30 ${i + 1} ${a.element} 0 0 0 0`;
    if (a.charge !== 0) line += ` CHG=${a.charge}`;
    if (a.isotope !== null) line += ` MASS=${a.isotope}`;
    if (a.radical > 0) line += ` RAD=${a.radical === 1 ? 2 : 3}`;
    line += ` VAL=${valence[i] === 0 ? -1 : valence[i]}`;
    atomLines.push(line);
  });
  const bondLines: string[] = kept.map((b, i) => `M  V30 ${i + 1} ${b.order} ${b.a + 1} ${b.b + 1}`);
  let next = atoms.length;
  atoms.forEach((a, i) => {
    const plain = a.hydrogens - a.hydrogenIsotopes.length;
    const masses = [...Array<null>(plain).fill(null), ...a.hydrogenIsotopes];
    for (const iso of masses) {
      next++;
      atomLines.push(`M  V30 ${next} H 0 0 0 0${iso === null ? '' : ` MASS=${iso}`} VAL=1`);
      bondLines.push(`M  V30 ${bondLines.length + 1} 1 ${i + 1} ${next}`);
    }
  });
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
