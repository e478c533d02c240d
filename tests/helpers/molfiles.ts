import type { Molecule } from '../../src/shared/chem';

// Writes MDL V2000 molfiles for upload tests (CTfile Formats, "V2000 connection table").

export interface FileAtom {
  element: string;
  x: number;
  y: number;
  z: number;
}

const f = (v: number) => v.toFixed(4).padStart(10);
const i3 = (v: number) => String(v).padStart(3);

export function v2000(title: string, atoms: FileAtom[], bonds: [number, number, number][]): string {
  const lines = [title, '  beadloom-test', '', `${i3(atoms.length)}${i3(bonds.length)}  0  0  0  0  0  0  0  0999 V2000`];
  for (const a of atoms) lines.push(`${f(a.x)}${f(a.y)}${f(a.z)} ${a.element.padEnd(3)} 0  0  0  0  0  0  0  0  0  0  0  0`);
  for (const [a, b, order] of bonds) lines.push(`${i3(a + 1)}${i3(b + 1)}${i3(order)}  0`);
  lines.push('M  END');
  return lines.join('\n') + '\n';
}

/** A flat molfile of the model's heavy atoms (hydrogens implicit). */
export function flatMolfile(title: string, model: Molecule): string {
  return v2000(title, model.atoms.map((a) => ({ element: a.element, x: a.x, y: a.y, z: 0 })), model.bonds.map((b) => [b.a, b.b, b.order || 1]));
}

/** A 3D molfile with every hydrogen explicit, atoms in the contract's order (heavy atoms, then H by parent). */
export function molfile3d(title: string, model: Molecule, xyz: number[][]): string {
  const atoms: FileAtom[] = model.atoms.map((a, i) => ({ element: a.element, x: xyz[i][0], y: xyz[i][1], z: xyz[i][2] }));
  const bonds: [number, number, number][] = model.bonds.map((b) => [b.a, b.b, b.order || 1]);
  let k = model.atoms.length;
  for (const a of model.atoms) {
    for (let h = 0; h < a.hydrogens; h++, k++) {
      atoms.push({ element: 'H', x: xyz[k][0], y: xyz[k][1], z: xyz[k][2] });
      bonds.push([a.index, k, 1]);
    }
  }
  return v2000(title, atoms, bonds);
}

export const sdf = (records: string[]) => records.map((r) => `${r}$$$$\n`).join('');
