/** Connected parts of a bond graph (union–find with path halving), each part's atoms in index order. */
export function componentsOf(n: number, bonds: readonly { a: number; b: number }[]): number[][] {
  const parent = Array.from({ length: n }, (_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) i = parent[i] = parent[parent[i]];
    return i;
  };
  for (const { a, b } of bonds) parent[find(a)] = find(b);
  const parts = new Map<number, number[]>();
  for (let i = 0; i < n; i++) {
    const r = find(i);
    const part = parts.get(r);
    if (part) part.push(i);
    else parts.set(r, [i]);
  }
  return [...parts.values()];
}
