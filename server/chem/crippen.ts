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
  return typeMolfile(rd, writeTypingMolfile(model), model.atoms);
}

/** Types a molfile from writeTypingMolfile (callers that cache by the molfile text use this). */
export function typeMolfile(rd: RDKit, molfile: string, atoms: Atom[]): Typing {
  const mol = rd.get_mol(molfile, READ_OPTIONS);
  if (!mol) {
    throw new ChemError(
      'valence_error',
      'The structure is not chemically valid (RDKit could not sanitize it: a valence or aromaticity problem).',
    );
  }
  try {
    const total = atoms.length + hydrogenCount(atoms);
    const z = checkSameAtoms(rd, mol, atoms, total);
    const typeOf: (TypeQuery | null)[] = new Array(total).fill(null);
    const left = new Map<number, number>();
    for (const zi of z) left.set(zi, (left.get(zi) ?? 0) + 1);
    let remaining = total;
    for (const q of typeQueries(rd)) {
      if (remaining === 0) break;
      let candidates = 0;
      for (const r of q.roots) candidates += left.get(r) ?? 0;
      if (candidates === 0) continue;
      for (const i of matchedAtoms(rd, mol, q.smarts, undefined, q.qmol!)) {
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
// Stereo plays no part in the types; skipping its perception and the symmetrized ring search makes
// large ring-rich molecules ~10× faster to read. Ring membership and aromaticity are still perceived;
// the RDKit panel test compares every result with RDKit's fully sanitized parse of the SMILES.
const READ_OPTIONS = JSON.stringify({ removeHs: false, assignStereo: false, fastFindRings: true });

const elementQueries = new Map<number, RDKitMol>();
/** Atoms a one-atom (or recursive) query matches. RDKit answers "{}" rather than "[]" for none. */
function matchedAtoms(rd: RDKit, mol: RDKitMol, smarts: string, cacheKey?: number, compiled?: RDKitMol): number[] {
  let q = compiled ?? (cacheKey === undefined ? null : (elementQueries.get(cacheKey) ?? null));
  if (!q) {
    q = rd.get_qmol(smarts);
    if (!q) throw new Error(`RDKit refused the SMARTS ${smarts}`);
    if (cacheKey !== undefined) elementQueries.set(cacheKey, q);
  }
  const found = JSON.parse(mol.get_substruct_matches(q, MATCH_ALL)) as { atoms: number[] }[] | object;
  return Array.isArray(found) ? found.map((m) => m.atoms[0]) : [];
}

/** RDKit must hold exactly our atoms, in our order, with no hydrogens of its own. Returns Z per atom. */
function checkSameAtoms(rd: RDKit, mol: RDKitMol, atoms: Atom[], total: number): number[] {
  if (mol.get_num_atoms() !== total) throw new Error(`RDKit read ${mol.get_num_atoms()} atoms, expected ${total}`);
  const z = new Array<number>(total).fill(1);
  atoms.forEach((a, i) => (z[i] = atomicNumber(a.element)));
  for (const el of new Set(z)) {
    const at = matchedAtoms(rd, mol, `[#${el}]`, el);
    const expected = z.reduce((n, zi) => n + (zi === el ? 1 : 0), 0);
    if (at.length !== expected || at.some((i) => z[i] !== el)) throw new Error(`RDKit's atoms of element ${el} are not ours`);
  }
  const withImplicitH = matchedAtoms(rd, mol, '[!h0]', 0);
  if (withImplicitH.length) throw new Error(`RDKit added implicit hydrogens to atom ${withImplicitH[0]}`);
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
