import type { Molecule } from '../../src/shared/chem';
import type { ImportBody, ImportCorrespondence } from '../../src/shared/exports';
import { unprocessable } from '../http/errors';
import { findCorrespondence, type MoleculeGraph } from './atom-correspondence';

// The file's atoms → the target molecule's atoms, as the import's answer describes them
// (ImportCorrespondence). A file with bonds is matched by structure; an older export that lists
// atoms but no bonds is accepted only when its atoms agree with the molecule's number by number.

const numbers = (atoms: readonly number[]) => atoms.map((i) => i + 1);

export function correspond(body: ImportBody, model: Molecule, moleculeName: string): ImportCorrespondence {
  const file = body.molecule;
  if (!file) throw unprocessable('structure_missing', 'The file does not list its molecule’s atoms and bonds, so its beads cannot be placed by structure; export it again from Beadloom.');
  file.atoms.forEach((a, i) => {
    if (a.number !== i + 1) throw unprocessable('import_invalid', `The file's atoms must be numbered 1, 2, 3… in order; entry ${i + 1} is numbered ${a.number}.`, { entry: i + 1, number: a.number });
  });
  if (!file.bonds) return byNumber(file.atoms, model, moleculeName);

  for (const b of file.bonds) {
    if (b.a > file.atoms.length || b.b > file.atoms.length || b.a === b.b) throw unprocessable('import_invalid', `The file has a bond ${b.a}–${b.b} between atoms it does not list.`, { bond: [b.a, b.b] });
  }
  const source: MoleculeGraph = { atoms: file.atoms.map((a) => ({ ...a, isotope: a.isotope ?? null })), bonds: file.bonds.map((b) => ({ ...b, a: b.a - 1, b: b.b - 1 })) };
  const result = findCorrespondence(source, model);
  if (!result.ok) {
    if (result.reason === 'too_hard') throw unprocessable('structure_too_symmetric', 'The file’s molecule could not be matched to this one within the search limit (a very symmetric structure).');
    throw unprocessable('structure_mismatch', `The file's atoms and bonds do not form ${moleculeName}: no atom of the file can be matched to the molecule with the same elements, charges, hydrogens and bonds.`, {
      fileAtoms: file.atoms.length,
      fileBonds: file.bonds.length,
      moleculeAtoms: model.atoms.length,
      moleculeBonds: model.bonds.length,
    });
  }
  const { map, equivalent, alternative } = result.value;
  const atoms = numbers(map);
  const renumbered = atoms.filter((n, i) => n !== i + 1).length;
  const choiceMatters = alternative !== null && beadsMove(body, map, alternative);
  return {
    method: 'structure',
    atoms,
    renumbered,
    symmetric: alternative !== null,
    choiceMatters,
    equivalentAtoms: equivalent.map(numbers),
    choice: alternative === null ? null : choiceSentence(map, alternative, choiceMatters),
  };
}

/** Whether some bead holds other atoms under `alt` than under `map`. */
function beadsMove(body: ImportBody, map: number[], alt: number[]): boolean {
  return body.content.beads.some((b) => {
    const one = new Set(b.atoms.map(([n]) => map[n - 1]));
    return b.atoms.some(([n]) => !one.has(alt[n - 1]));
  });
}

function choiceSentence(map: number[], alt: number[], matters: boolean): string {
  const moved = map.map((t, s) => [s, t, alt[s]]).filter(([, t, u]) => t !== u).slice(0, 4);
  const pairs = moved.map(([s, t, u]) => `file atom ${s + 1} → atom ${t + 1} (not ${u + 1})`).join(', ');
  const identity = map.every((t, s) => t === s);
  const rule = identity ? 'every atom kept its number' : 'the lowest atom numbers were taken';
  return matters
    ? `The molecule is symmetric, so more than one placement fits; ${rule}: ${pairs}. The mirror placement would put some beads on the symmetric partner atoms.`
    : `The molecule is symmetric, so more than one placement fits; ${rule}: ${pairs}. Every bead covers the same atoms either way.`;
}

function byNumber(atoms: NonNullable<ImportBody['molecule']>['atoms'], model: Molecule, moleculeName: string): ImportCorrespondence {
  const same =
    atoms.length === model.atoms.length &&
    atoms.every((a, i) => a.element === model.atoms[i].element && a.charge === model.atoms[i].charge && a.hydrogens === model.atoms[i].hydrogens);
  if (!same) {
    throw unprocessable('structure_mismatch', `The file lists no bonds, and its atoms are not ${moleculeName}'s atoms in the same order, so its beads cannot be placed safely; export it again from Beadloom.`, {
      fileAtoms: atoms.length,
      moleculeAtoms: model.atoms.length,
    });
  }
  return { method: 'atom-number', atoms: atoms.map((_a, i) => i + 1), renumbered: 0, symmetric: false, choiceMatters: false, equivalentAtoms: [], choice: null };
}
