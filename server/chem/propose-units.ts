/**
 * Units of the mapping proposal: sets of atoms that always go into one bead (propose.ts).
 *
 * A unit is a charged group (charged-groups.ts) or one of these listed functional groups (our list;
 * docs/chemistry.md, "Mapping proposals"), and groups that touch are one unit:
 *  - a terminal O, S or N multiply bonded to its neighbour stays with it: carbonyl C=O, thiocarbonyl
 *    C=S, nitrile C≡N, sulfoxide/sulfonyl S=O, phosphoryl P=O, nitroso/nitro N=O, imine C=NH;
 *  - a carbonyl or thiocarbonyl carbon keeps its single-bonded O, N and S neighbours: carboxylic acid,
 *    ester (the C(=O)O, not the alkyl carbon), amide, carbamate, urea, carbonate, thioester; a
 *    heteroatom between two carbonyls (imide N, anhydride O) belongs to neither;
 *  - a sulfur or phosphorus centre with at least one terminal O keeps every terminal O/S and every O
 *    or N that links it to a carbon (sulfonate, sulfonic acid, sulfate, sulfonamide, phosphate,
 *    phosphonate); an O that bridges two such centres (a pyrophosphate) belongs to neither;
 *  - the two carbons of a C≡C triple bond;
 *  - a charged atom keeps its terminal halogens (BF4⁻, PF6⁻).
 * Only heavy atoms that are free to map (not fixed by the caller) take part.
 */
import type { Molecule } from '../../src/shared/chem';
import { chargedGroups } from './charged-groups';
import type { Prepared } from './prepared';

const HALOGENS = new Set(['F', 'Cl', 'Br', 'I']);

export interface Units {
  /** Unit id of each atom (-1 for atoms that take no part). */
  unitOf: Int32Array;
  /** Atoms of each unit, ascending. */
  atoms: number[][];
  /** Why each unit exists ('' for a lone atom). */
  reason: string[];
}

export function findUnits(molecule: Molecule, p: Prepared, free: Uint8Array): Units {
  const { atoms } = molecule;
  const n = p.n;
  const parent = Int32Array.from({ length: n }, (_, i) => i);
  const why: Set<string>[] = Array.from({ length: n }, () => new Set());
  const find = (i: number): number => {
    while (parent[i] !== i) i = parent[i] = parent[parent[i]];
    return i;
  };
  const join = (a: number, b: number, reason: string): void => {
    if (!free[a] || !free[b]) return;
    const ra = find(a);
    const rb = find(b);
    if (ra !== rb) {
      parent[ra] = rb;
      for (const w of why[ra]) why[rb].add(w);
    }
    why[rb].add(reason);
  };
  const nbrs = (a: number): [number, number][] => {
    const out: [number, number][] = [];
    for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) out.push([p.adj[k], p.adjOrder[k]]);
    return out;
  };
  const degree = (a: number): number => p.adjStart[a + 1] - p.adjStart[a];
  const el = (a: number): string => atoms[a].element;
  const terminalHetero = (b: number): boolean => degree(b) === 1 && (el(b) === 'O' || el(b) === 'S' || el(b) === 'N');

  for (const g of chargedGroups(molecule, p)) {
    for (const a of g.atoms) {
      if (free[a]) why[find(a)].add('charged group');
      if (a !== g.atoms[0]) join(g.atoms[0], a, 'charged group');
    }
  }
  const carbonyl = (a: number): boolean => el(a) === 'C' && nbrs(a).some(([b, o]) => o === 2 && degree(b) === 1 && (el(b) === 'O' || el(b) === 'S'));
  // A charged centre keeps its terminal halogens: BF4⁻, PF6⁻ are one ion.
  for (let a = 0; a < n; a++) {
    if (atoms[a].charge === 0) continue;
    for (const [b] of nbrs(a)) if (degree(b) === 1 && HALOGENS.has(el(b))) join(a, b, 'charged group');
  }
  const centre = (a: number): boolean => (el(a) === 'S' || el(a) === 'P') && nbrs(a).some(([b]) => degree(b) === 1 && el(b) === 'O');
  for (let a = 0; a < n; a++) {
    if (!p.heavy[a]) continue;
    const list = nbrs(a);
    const multiTerminal = list.filter(([b, o]) => o >= 2 && terminalHetero(b));
    for (const [b] of multiTerminal) join(a, b, multipleName(el(a), el(b)));
    if (carbonyl(a)) {
      // A heteroatom between two carbonyls (imide N, anhydride O) belongs to neither, so the rule
      // does not chain carbonyls into one ever larger unit.
      const singles = list.filter(([b, o]) => o === 1 && (el(b) === 'O' || el(b) === 'N' || el(b) === 'S') && nbrs(b).filter(([c]) => carbonyl(c)).length === 1);
      for (const [b] of singles) join(a, b, carbonylName(list, el));
    }
    if (centre(a)) {
      const name = el(a) === 'P' ? 'phosphate/phosphonate' : 'sulfonate/sulfate/sulfonamide';
      for (const [b] of list) {
        if (terminalHetero(b) && el(b) !== 'N') join(a, b, name);
        else if (el(b) === 'O' || el(b) === 'N') {
          const others = nbrs(b).filter(([c]) => c !== a);
          if (!others.some(([c]) => centre(c))) join(a, b, name);
        }
      }
    }
    for (const [b, o] of list) if (o === 3 && el(a) === 'C' && el(b) === 'C') join(a, b, 'triple bond');
  }

  const unitOf = new Int32Array(n).fill(-1);
  const out: number[][] = [];
  const reason: string[] = [];
  const idOfRoot = new Map<number, number>();
  for (let a = 0; a < n; a++) {
    if (!free[a]) continue;
    const r = find(a);
    let id = idOfRoot.get(r);
    if (id === undefined) {
      id = out.push([]) - 1;
      idOfRoot.set(r, id);
      reason.push([...why[r]].sort().join(', '));
    }
    out[id].push(a);
    unitOf[a] = id;
  }
  return { unitOf, atoms: out, reason };
}

function multipleName(centre: string, terminal: string): string {
  if (centre === 'C' && terminal === 'N') return 'nitrile/imine';
  if (centre === 'C') return terminal === 'O' ? 'carbonyl' : 'thiocarbonyl';
  if (centre === 'N') return 'nitro/nitroso';
  if (centre === 'S') return 'sulfonyl/sulfoxide';
  if (centre === 'P') return 'phosphoryl';
  return `${centre}=${terminal}`;
}

function carbonylName(list: [number, number][], el: (a: number) => string): string {
  const singles = list.filter(([, o]) => o === 1).map(([b]) => el(b));
  if (singles.includes('N')) return singles.filter((e) => e === 'N').length > 1 || singles.includes('O') ? 'urea/carbamate' : 'amide';
  if (singles.filter((e) => e === 'O').length > 1) return 'carbonate';
  if (singles.includes('S')) return 'thioester';
  return 'carboxyl/ester';
}
