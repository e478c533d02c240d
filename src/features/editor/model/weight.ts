// A shared atom's weight lies strictly between 0 and 1: 1 would be the atom wholly in one bead
// (an assignment, not a share) and 0 the atom not in it (a removal); docs/chemistry.md.

/** What a typed weight means: a number strictly between 0 and 1, or why not. */
export function parseWeight(text: string): { weight: number } | { error: string } {
  const t = text.trim().replace(',', '.');
  if (t === '') return { error: 'Enter a weight between 0 and 1, e.g. 0.5.' };
  if (!/^[+]?(\d+\.?\d*|\.\d+)$/.test(t)) return { error: `“${text.trim()}” is not a number; enter a weight between 0 and 1, e.g. 0.5.` };
  const w = Number(t);
  if (w <= 0) return { error: 'A weight is more than 0; to take the atom out of this bead, remove it from the bead.' };
  if (w >= 1) return { error: 'A shared atom’s weight is less than 1; to put the atom wholly in this bead, assign it to the bead.' };
  return { weight: w };
}
