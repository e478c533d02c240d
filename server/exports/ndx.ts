import type { Molecule } from '../../src/shared/chem';

// GROMACS index files (.ndx): one group per bead, for mapping an all-atom trajectory onto the CG model
// (gmx traj/trajectory tools take `-n`). The format as GROMACS itself writes it (write_index in its
// topology/index.cpp, checked against `gmx make_ndx` 2022.5 output): a `[ name ]` line per group, then
// the group's 1-based atom numbers right-aligned in four columns, separated by one space, at most 15
// a line. Lines starting with ';' are comments (`gmx check -n` and `gmx make_ndx -n` read past them).
// Group names are single words here: GROMACS trims them, and tools that pick a group by name
// (`gmx select 'group "..."'`) are simpler without blanks.

export interface IndexGroup {
  name: string;
  /** 1-based atom numbers in the target numbering (a molecule's, or a whole system's over all copies). */
  atoms: readonly number[];
}

export const NDX_PER_LINE = 15;

/** A bead name as a group name: blanks become '_', brackets (the header's delimiters) are dropped. */
export function ndxGroupName(name: string): string {
  const word = name.trim().replace(/[[\]]/g, '').replace(/\s+/g, '_');
  return word === '' ? 'bead' : word;
}

/** The .ndx text of these groups; `comments` become leading ';' lines. Pure: no file, no molecule. */
export function writeNdx(groups: readonly IndexGroup[], comments: readonly string[] = []): string {
  const lines = comments.map((c) => `; ${c.replace(/[\r\n]+/g, ' ')}`);
  for (const g of groups) {
    for (const n of g.atoms) if (!Number.isInteger(n) || n < 1) throw new RangeError(`Index group ${g.name}: atom number ${n} is not a positive whole number.`);
    lines.push(`[ ${ndxGroupName(g.name)} ]`);
    for (let k = 0; k < g.atoms.length; k += NDX_PER_LINE) {
      lines.push(g.atoms.slice(k, k + NDX_PER_LINE).map((n) => String(n).padStart(4)).join(' '));
    }
  }
  return lines.join('\n') + '\n';
}

/**
 * The molecule's all-atom numbering (1-based), after the atom-index contract (src/shared/chem.ts):
 * every listed atom in index order first (1 … N), then each atom's hydrogens grouped by parent in
 * parent order. Returns, per atom index, its own number followed by its hydrogens' numbers.
 */
export function moleculeAtomNumbers(model: Pick<Molecule, 'atoms'>): number[][] {
  let next = model.atoms.length + 1;
  return model.atoms.map((a, i) => {
    const own = [i + 1];
    for (let h = 0; h < a.hydrogens; h++) own.push(next++);
    return own;
  });
}

/**
 * One group per bead in the molecule's numbering: each mapped atom with its hydrogens (a hydrogen
 * moves with its heavy atom in a mapping), sorted. A shared atom is in each of its beads' groups.
 * Shift by `offset` to number a later copy of the molecule in a system.
 */
export function beadIndexGroups(model: Pick<Molecule, 'atoms'>, beads: readonly { name: string; atoms: readonly { index: number }[] }[], offset = 0): IndexGroup[] {
  const numbers = moleculeAtomNumbers(model);
  return beads.map((b) => ({
    name: b.name,
    atoms: b.atoms.flatMap((a) => numbers[a.index] ?? []).map((n) => n + offset).sort((x, y) => x - y),
  }));
}
