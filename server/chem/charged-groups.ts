/**
 * Charged groups: the atoms that a CG model should keep in one bead because they share one charge.
 *
 * Rule (ours; docs/chemistry.md has it with examples). A charged group is a formally charged atom plus
 * the atoms that share its charge by resonance or by charge separation:
 *  1. Charge separation: formally charged atoms bonded to each other are one group (N-oxide N⁺–O⁻,
 *     the N⁺ and O⁻ of a nitro group, an ylide).
 *  2. Anion resonance: a terminal O⁻ or S⁻ on a centre atom X shares its charge with X's other terminal
 *     O/S atoms that carry no hydrogen and are double-bonded to X or negatively charged; when there is
 *     at least one such partner the group holds the O⁻, X and the partners (carboxylate C and both O,
 *     sulfonate S and three O, phosphate P and its O without H, the nitro group's =O). Without a partner
 *     the O⁻ stands alone (an alkoxide or phenoxide: the charge sits on the O).
 *  3. Cation resonance: an N⁺ double-bonded to a carbon shares its charge with that carbon's other
 *     single-bonded, uncharged nitrogens; when there is one the group holds the N⁺, the C and those N
 *     (amidinium, guanidinium, the N–C–N of imidazolium in a Kekulé form).
 *  4. Anything else charged stands alone: a quaternary or protonated ammonium is its centre only
 *     (the hydrogens belong to it), a metal ion is itself.
 * Groups that touch merge. A group's net charge may be zero (nitro, N-oxide: charge-separated but
 * neutral); such groups still count when they are split, because splitting them puts opposite charges
 * in two beads. A group is split when its atoms are held by more than one bead (a shared atom counts
 * for each bead that holds it); a lone NH₃⁺ or O⁻ wholly in one bead is not split.
 */
import type { Molecule } from '../../src/shared/chem';
import { prepare, type Prepared } from './prepared';

export interface ChargedGroup {
  /** Atom indices, ascending. */
  atoms: number[];
  /** Σ formal charges of the group's atoms (0 for a charge-separated neutral group). */
  netCharge: number;
}

const cache = new WeakMap<Molecule, ChargedGroup[]>();

export function chargedGroups(molecule: Molecule, p: Prepared): ChargedGroup[] {
  const hit = cache.get(molecule);
  if (hit) return hit;
  const { atoms } = molecule;
  const parent = Array.from({ length: p.n }, (_, i) => i);
  const inGroup = new Uint8Array(p.n);
  const find = (i: number): number => {
    while (parent[i] !== i) i = parent[i] = parent[parent[i]];
    return i;
  };
  const join = (a: number, b: number): void => {
    inGroup[a] = inGroup[b] = 1;
    parent[find(a)] = find(b);
  };
  const degree = (a: number): number => p.adjStart[a + 1] - p.adjStart[a];
  const neighbours = (a: number): [number, number][] => {
    const out: [number, number][] = [];
    for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) out.push([p.adj[k], p.adjOrder[k]]);
    return out;
  };
  const isChalcogen = (a: number): boolean => atoms[a].element === 'O' || atoms[a].element === 'S';

  for (let a = 0; a < p.n; a++) {
    const q = atoms[a].charge;
    if (q === 0) continue;
    inGroup[a] = 1;
    for (const [b, order] of neighbours(a)) {
      if (atoms[b].charge !== 0) join(a, b); // rule 1
      if (q < 0 && degree(a) === 1 && isChalcogen(a)) {
        // rule 2: partners of the anion on its centre b
        const partners = neighbours(b).filter(([c, o]) => c !== a && degree(c) === 1 && isChalcogen(c) && atoms[c].hydrogens === 0 && (o === 2 || atoms[c].charge < 0));
        if (partners.length) {
          join(a, b);
          for (const [c] of partners) join(b, c);
        }
      }
      if (q > 0 && atoms[a].element === 'N' && order === 2 && atoms[b].element === 'C') {
        // rule 3: amidinium / guanidinium nitrogens on the carbon b
        const partners = neighbours(b).filter(([c, o]) => c !== a && atoms[c].element === 'N' && o === 1 && atoms[c].charge === 0);
        if (partners.length) {
          join(a, b);
          for (const [c] of partners) join(b, c);
        }
      }
    }
  }
  const groups = new Map<number, number[]>();
  for (let a = 0; a < p.n; a++) {
    if (!inGroup[a]) continue;
    const r = find(a);
    const g = groups.get(r);
    if (g) g.push(a);
    else groups.set(r, [a]);
  }
  const out = [...groups.values()].map((g) => ({ atoms: g, netCharge: g.reduce((s, a) => s + atoms[a].charge, 0) }));
  cache.set(molecule, out);
  return out;
}

/**
 * Whether a molecule's Wildman–Crippen logP describes a charged species (an ion, a salt or a
 * zwitterion): some charged group carries a net charge. Nitro groups and N-oxides alone do not.
 */
export function isChargedSpecies(molecule: Molecule, p: Prepared): boolean {
  return chargedGroups(molecule, p).some((g) => g.netCharge !== 0);
}

/** The warning that goes with a charged species' logP, or null (API responses and the molecule page). */
export function logPWarningOf(molecule: Molecule): string | null {
  return isChargedSpecies(molecule, prepare(molecule)) ? CHARGED_LOGP_WARNING : null;
}

export const CHARGED_LOGP_WARNING =
  'This is a charged species (an ion, salt or zwitterion). Wildman–Crippen logP adds atom contributions as for a neutral molecule; for ions it does not describe octanol/water partitioning, which depends on pH and counter-ions. Use a measured value.';
