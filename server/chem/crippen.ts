/**
 * Wildman–Crippen logP by atomic contributions (Wildman & Crippen, J. Chem. Inf. Comput. Sci. 1999, 39,
 * 868–873).
 *
 * logP = Σ_i a_i over all atoms, hydrogens included, where a_i is the contribution of atom i's type
 * (crippen-types.ts). Each hydrogen's contribution is credited to the heavy atom it sits on, so a heavy
 * atom's value is its own contribution plus its hydrogens'.
 *
 * Protocol: RDKit reads a molfile written from our model (molfile.ts), so its atom k is our atom k with
 * exactly our hydrogen count; we check element by element and hydrogen count by hydrogen count. Rows
 * are tried in table order and an atom keeps the first type that matches it. A row is matched as the
 * recursive SMARTS `[$(row)]`, true exactly for the atoms the row's first atom can map to; consecutive
 * rows of one type are OR-ed into one query, and a query is skipped once no untyped atom of the
 * elements it can start on is left. Hydrogens stay implicit (three times fewer atoms for RDKit to read
 * and search): the H rows are matched through their parent-rooted form (crippen-types.ts), and all
 * hydrogens of one atom share a type. Atoms no row types (e.g. noble gases) contribute 0, with a
 * warning. Aromaticity is RDKit's own perception of the Kekulé structure.
 */
import type { Atom, Bond } from '../../src/shared/chem';
import { CRIPPEN_TYPES } from './crippen-types';
import { atomicNumber } from './elements';
import { ChemError } from './errors';
import { writeTypingMolfile } from './molfile';
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

/** Atomic numbers the first atom of a SMARTS can be ('*' = any). */
export function rootElements(smarts: string): Set<number> | '*' {
  const first = /^\[([^\]]*)\]/.exec(smarts)?.[1] ?? '';
  if (first === '*' || /^!/.test(first)) return '*';
  const out = new Set<number>();
  for (const m of first.matchAll(/#(\d+)/g)) out.add(Number(m[1]));
  for (const m of first.matchAll(/(?<![!#A-Za-z])(Cl|Br|[CNOPScnops])(?![a-z])/g)) out.add(SYMBOL_Z[m[1]]);
  return out;
}

function group(rd: RDKit, rows: { type: string; logP: number; smarts: string }[]): TypeQuery[] {
  const grouped: TypeQuery[] = [];
  for (const row of rows) {
    const roots = rootElements(row.smarts);
    const last = grouped[grouped.length - 1];
    if (last && last.type === row.type && last.logP === row.logP) {
      last.smarts += `,$(${row.smarts})`;
      if (roots === '*') last.roots = new Set(Array.from({ length: 119 }, (_, z) => z));
      else for (const z of roots) last.roots.add(z);
    } else {
      const all = roots === '*' ? new Set(Array.from({ length: 119 }, (_, z) => z)) : roots;
      grouped.push({ type: row.type, logP: row.logP, roots: all, smarts: `$(${row.smarts})`, qmol: null });
    }
  }
  for (const q of grouped) {
    q.qmol = rd.get_qmol(`[${q.smarts}]`);
    if (!q.qmol) throw new Error(`RDKit refused the SMARTS of Wildman–Crippen type ${q.type}`);
  }
  return grouped;
}

let heavyQueries: TypeQuery[] | null = null;
let hydrogenQueries: TypeQuery[] | null = null;
let ownHydrogenQueries: TypeQuery[] | null = null;

function queries(rd: RDKit): { heavy: TypeQuery[]; hydrogen: TypeQuery[]; ownHydrogen: TypeQuery[] } {
  heavyQueries ??= group(rd, CRIPPEN_TYPES.filter((r) => !r.parentSmarts));
  hydrogenQueries ??= group(
    rd,
    CRIPPEN_TYPES.filter((r) => r.parentSmarts).map((r) => ({ type: r.type, logP: r.logP, smarts: r.parentSmarts! })),
  );
  // A hydrogen that is an atom of the model (H2, H+, H-, the H atom: no heavy atom to belong to) is
  // typed by the H rows as written, on itself.
  ownHydrogenQueries ??= group(rd, CRIPPEN_TYPES.filter((r) => r.parentSmarts));
  return { heavy: heavyQueries, hydrogen: hydrogenQueries, ownHydrogen: ownHydrogenQueries };
}

export function typeAtoms(rd: RDKit, model: { atoms: Atom[]; bonds: Bond[] }): Typing {
  return typeMolfile(rd, writeTypingMolfile(model), model.atoms);
}

const MATCH_ALL = JSON.stringify({ uniquify: false, maxMatches: 1_000_000 });
// Stereo plays no part in the types; skipping its perception and the symmetrized ring search makes
// large ring-rich molecules much faster to read. Ring membership and aromaticity are still perceived;
// the RDKit panel test compares every result with RDKit's fully sanitized parse of the SMILES.
const READ_OPTIONS = JSON.stringify({ assignStereo: false, fastFindRings: true });

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
    const z = checkSameAtoms(rd, mol, atoms);
    const { heavy, hydrogen, ownHydrogen } = queries(rd);
    const own = firstMatches(rd, mol, heavy, z, atoms.map((a) => a.element !== 'H'));
    if (atoms.some((a) => a.element === 'H')) {
      firstMatches(rd, mol, ownHydrogen, z, atoms.map((a) => a.element === 'H')).forEach((q, i) => {
        if (atoms[i].element === 'H') own[i] = q;
      });
    }
    const hType = firstMatches(rd, mol, hydrogen, z, atoms.map((a) => a.hydrogens > 0));
    return collect(atoms, own, hType);
  } finally {
    mol.delete();
  }
}

/** For each atom that `wanted` marks, the first query (in order) that matches it. */
function firstMatches(rd: RDKit, mol: RDKitMol, qs: TypeQuery[], z: number[], wanted: boolean[]): (TypeQuery | null)[] {
  const typeOf: (TypeQuery | null)[] = new Array(z.length).fill(null);
  const left = new Map<number, number>();
  let remaining = 0;
  z.forEach((zi, i) => {
    if (!wanted[i]) return;
    left.set(zi, (left.get(zi) ?? 0) + 1);
    remaining++;
  });
  for (const q of qs) {
    if (remaining === 0) break;
    let candidates = 0;
    for (const [zi, n] of left) if (q.roots.has(zi)) candidates += n;
    if (candidates === 0) continue;
    for (const i of matchedAtoms(rd, mol, q.smarts, q.qmol!)) {
      if (!wanted[i] || typeOf[i] !== null) continue;
      typeOf[i] = q;
      remaining--;
      left.set(z[i], left.get(z[i])! - 1);
    }
  }
  return typeOf;
}

const checkQueries = new Map<string, RDKitMol>();

/** Atoms a one-atom (or recursive) query matches. RDKit answers "{}" rather than "[]" for none. */
function matchedAtoms(rd: RDKit, mol: RDKitMol, smarts: string, compiled?: RDKitMol): number[] {
  let q = compiled ?? checkQueries.get(smarts) ?? null;
  if (!q) {
    q = rd.get_qmol(smarts);
    if (!q) throw new Error(`RDKit refused the SMARTS ${smarts}`);
    checkQueries.set(smarts, q);
  }
  const found = JSON.parse(mol.get_substruct_matches(q, MATCH_ALL)) as { atoms: number[] }[] | object;
  return Array.isArray(found) ? found.map((m) => m.atoms[0]) : [];
}

/** RDKit must hold exactly our atoms, in our order, each with our hydrogen count. Returns Z per atom. */
function checkSameAtoms(rd: RDKit, mol: RDKitMol, atoms: Atom[]): number[] {
  if (mol.get_num_atoms() !== atoms.length) throw new Error(`RDKit read ${mol.get_num_atoms()} atoms, expected ${atoms.length}`);
  const z = atoms.map((a) => atomicNumber(a.element));
  const same = (smarts: string, ours: (i: number) => boolean): void => {
    const at = matchedAtoms(rd, mol, smarts);
    const expected = atoms.reduce((n, _, i) => n + (ours(i) ? 1 : 0), 0);
    if (at.length !== expected || at.some((i) => !ours(i))) throw new Error(`RDKit's atoms for ${smarts} are not ours`);
  };
  for (const el of new Set(z)) same(`[#${el}]`, (i) => z[i] === el);
  // A hydrogen atom of the model (H2) counts its bonded hydrogen in SMARTS `H`; only others are compared.
  for (const h of new Set(atoms.map((a) => a.hydrogens))) same(`[!#1;H${h}]`, (i) => atoms[i].element !== 'H' && atoms[i].hydrogens === h);
  return z;
}

function collect(atoms: Atom[], own: (TypeQuery | null)[], hType: (TypeQuery | null)[]): Typing {
  const atomLogP = atoms.map((a, i) => (own[i]?.logP ?? 0) + a.hydrogens * (hType[i]?.logP ?? 0));
  const atomTypes = atoms.map((_, i) => own[i]?.type ?? '');
  const untyped = new Set<string>();
  atoms.forEach((a, i) => {
    if (!own[i] && !a.attachment) untyped.add(a.element);
  });
  let logP = 0;
  for (const v of atomLogP) logP += v;
  return { atomLogP, atomTypes, logP, untypedElements: [...untyped] };
}
