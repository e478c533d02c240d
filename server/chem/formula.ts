/**
 * Molecular formula in Hill order: C first, then H, then the other symbols alphabetically; without
 * carbon, all symbols alphabetically. Isotope-labelled atoms are written as their own symbol right after
 * their element ([13C] after C, D and T after H). A net charge follows after a space: "C2H3O2 -",
 * "O4S 2-", "H4N +". Attachment points (`*`) are left out: a repeat unit's formula is its own atoms'.
 */
import type { Atom } from '../../src/shared/chem';

function symbolOf(element: string, isotope: number | null): string {
  if (isotope === null) return element;
  if (element === 'H' && isotope === 2) return 'D';
  if (element === 'H' && isotope === 3) return 'T';
  return `[${isotope}${element}]`;
}

/** Sort key: element, then unlabelled before labelled. */
function hillKey(element: string, isotope: number | null, hasCarbon: boolean): string {
  const rank = hasCarbon && element === 'C' ? '0' : hasCarbon && element === 'H' ? '1' : '2';
  return `${rank}${element.padEnd(2, ' ')}${String(isotope ?? 0).padStart(3, '0')}`;
}

export function hillFormula(atoms: Atom[]): string {
  const counts = new Map<string, { element: string; isotope: number | null; n: number }>();
  const add = (element: string, isotope: number | null, n: number): void => {
    if (n === 0) return;
    const key = `${element}:${isotope ?? ''}`;
    const entry = counts.get(key) ?? { element, isotope, n: 0 };
    entry.n += n;
    counts.set(key, entry);
  };
  let charge = 0;
  for (const a of atoms) {
    if (a.attachment) continue; // an attachment point is not part of the formula
    add(a.element, a.isotope, 1);
    add('H', null, a.hydrogens - a.hydrogenIsotopes.length);
    for (const iso of a.hydrogenIsotopes) add('H', iso, 1);
    charge += a.charge;
  }
  const hasCarbon = atoms.some((a) => a.element === 'C');
  const parts = [...counts.values()]
    .sort((p, q) => (hillKey(p.element, p.isotope, hasCarbon) < hillKey(q.element, q.isotope, hasCarbon) ? -1 : 1))
    .map((e) => `${symbolOf(e.element, e.isotope)}${e.n > 1 ? e.n : ''}`);
  const formula = parts.join('');
  if (charge === 0) return formula;
  const size = Math.abs(charge) > 1 ? String(Math.abs(charge)) : '';
  return `${formula} ${size}${charge > 0 ? '+' : '-'}`;
}
