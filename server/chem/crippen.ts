/**
 * Wildman–Crippen logP by atomic contributions (Wildman & Crippen, J. Chem. Inf. Comput. Sci. 1999, 39,
 * 868–873).
 *
 * logP = Σ_i a_i over all atoms, hydrogens included, where a_i is the contribution of atom i's type
 * (crippen-types.ts). Each hydrogen's contribution is credited to the heavy atom it sits on, so a heavy
 * atom's value is its own contribution plus its hydrogens'.
 *
 * Protocol: RDKit reads a molfile written from our model with every hydrogen explicit (molfile.ts), so
 * its atom k is our atom k; we check that element by element and that RDKit added no hydrogens. Rows
 * are tried in table order and an atom keeps the first type that matches it. A row is matched as the
 * recursive SMARTS `[$(row)]`, which is true exactly for the atoms the row's first atom can map to;
 * consecutive rows of one type are OR-ed into one query, and a query is skipped when no untyped atom of
 * the elements it can start on is left. Atoms no row types (e.g. noble gases) contribute 0, with a
 * warning. Aromaticity is RDKit's own perception of the Kekulé structure.
 */
import type { Atom, Bond } from '../../src/shared/chem';
import { CRIPPEN_TYPES } from './crippen-types';
import { ChemError } from './errors';
import { atomicNumber } from './elements';
import { hydrogenCount, writeTypingMolfile } from './molfile';
import type { RDKit, RDKitMol } from './rdkit';

interface TypeQuery {
  type: string;
  logP: number;
  roots: Set<number>;
  smarts: string;
  qmol: RDKitMol | null;
}

export interface Typing {
  /** Per heavy atom: own contribution + its hydrogens'. */
  atomLogP: number[];
  atomTypes: string[];
  logP: number;
  untypedElements: string[];
}

const SYMBOL_Z: Record<string, number> = { C: 6, c: 6, N: 7, n: 7, O: 8, o: 8, P: 15, p: 15, S: 16, s: 16, Cl: 17, Br: 35 };

/** Atomic numbers the first atom of a SMARTS can be. */
export function rootElements(smarts: string): Set<number> {
  const first = /^\[([^\]]*)\]/.exec(smarts)?.[1] ?? '';
  const out = new Set<number>();
  for (const m of first.matchAll(/#(\d+)/g)) out.add(Number(m[1]));
  for (const m of first.matchAll(/(?<![!#A-Za-z])(Cl|Br|[CNOPScnops])(?![a-z])/g)) out.add(SYMBOL_Z[m[1]]);
  return out;
}

let queries: TypeQuery[] | null = null;

function typeQueries(rd: RDKit): TypeQuery[] {
  if (queries) return queries;
  const grouped: TypeQuery[] = [];
  for (const row of CRIPPEN_TYPES) {
    const last = grouped[grouped.length - 1];
    if (last && last.type === row.type && last.logP === row.logP) {
      last.smarts += `,$(${row.smarts})`;
      for (const z of rootElements(row.smarts)) last.roots.add(z);
    } else {
      grouped.push({ type: row.type, logP: row.logP, roots: rootElements(row.smarts), smarts: `$(${row.smarts})`, qmol: null });
    }
  }
  for (const q of grouped) {
    q.qmol = rd.get_qmol(`[${q.smarts}]`);
    if (!q.qmol) throw new Error(`RDKit refused the SMARTS of Wildman–Crippen type ${q.type}`);
  }
  queries = grouped;
  return grouped;
}

export function typeAtoms(rd: RDKit, model: { atoms: Atom[]; bonds: Bond[] }): Typing {
  const { atoms } = model;
  const mol = rd.get_mol(writeTypingMolfile(model), JSON.stringify({ removeHs: false }));
  if (!mol) {
    throw new ChemError(
      'valence_error',
      'The structure is not chemically valid (RDKit could not sanitize it: a valence or aromaticity problem).',
    );
  }
  try {
    const total = atoms.length + hydrogenCount(atoms);
    const z = checkSameAtoms(mol, atoms, total);
    const typeOf: (TypeQuery | null)[] = new Array(total).fill(null);
    const left = new Map<number, number>();
    for (const zi of z) left.set(zi, (left.get(zi) ?? 0) + 1);
    let remaining = total;
    for (const q of typeQueries(rd)) {
      if (remaining === 0) break;
      let candidates = 0;
      for (const r of q.roots) candidates += left.get(r) ?? 0;
      if (candidates === 0) continue;
      const found = JSON.parse(mol.get_substruct_matches(q.qmol!, MATCH_ALL)) as { atoms: number[] }[] | object;
      // RDKit answers "{}" rather than "[]" when nothing matches.
      for (const m of Array.isArray(found) ? found : []) {
        const i = m.atoms[0];
        if (typeOf[i] !== null) continue;
        typeOf[i] = q;
        remaining--;
        left.set(z[i], (left.get(z[i]) ?? 1) - 1);
      }
    }
    return collect(atoms, typeOf);
  } finally {
    mol.delete();
  }
}

const MATCH_ALL = JSON.stringify({ uniquify: false, maxMatches: 1_000_000 });

interface RdkitJson {
  molecules: { atoms: { z?: number; impHs?: number }[] }[];
  defaults: { atom: { z: number; impHs: number } };
}

/** RDKit must hold exactly our atoms, in our order, with no hydrogens of its own. */
function checkSameAtoms(mol: RDKitMol, atoms: Atom[], total: number): number[] {
  const json = JSON.parse(mol.get_json()) as RdkitJson;
  const rdAtoms = json.molecules[0]?.atoms ?? [];
  const def = json.defaults.atom;
  if (rdAtoms.length !== total) throw new Error(`RDKit read ${rdAtoms.length} atoms, expected ${total}`);
  const z = rdAtoms.map((a) => a.z ?? def.z);
  rdAtoms.forEach((a, i) => {
    if ((a.impHs ?? def.impHs) !== 0) throw new Error(`RDKit added implicit hydrogens to atom ${i}`);
  });
  atoms.forEach((a, i) => {
    if (z[i] !== atomicNumber(a.element)) throw new Error(`RDKit atom ${i} is Z=${z[i]}, model says ${a.element}`);
  });
  for (let i = atoms.length; i < total; i++) if (z[i] !== 1) throw new Error(`RDKit atom ${i} should be H`);
  return z;
}

function collect(atoms: Atom[], typeOf: (TypeQuery | null)[]): Typing {
  const atomLogP = atoms.map((_, i) => typeOf[i]?.logP ?? 0);
  const atomTypes = atoms.map((_, i) => typeOf[i]?.type ?? '');
  const untyped = new Set<string>();
  atoms.forEach((a, i) => {
    if (!typeOf[i]) untyped.add(a.element);
  });
  let h = atoms.length;
  atoms.forEach((a, i) => {
    for (let k = 0; k < a.hydrogens; k++, h++) atomLogP[i] += typeOf[h]?.logP ?? 0;
  });
  let logP = 0;
  for (const v of atomLogP) logP += v;
  return { atomLogP, atomTypes, logP, untypedElements: [...untyped] };
}
