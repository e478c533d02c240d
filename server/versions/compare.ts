import type { BeadEvaluation, Evaluation, Mapping, MappingBead } from '../../src/shared/chem';
import type { Comparison } from '../../src/shared/versions';

// What changed between two states of a mapping (a version or the draft). Beads are matched by id,
// which survives renames, retyping and restores; an atom "moved" when the set of beads holding it,
// or its weight in one of them, differs between the two sides.

export interface MappingState {
  ref: number | 'draft';
  draft: Mapping;
  evaluation: Evaluation | null;
}

function membership(m: Mapping): Map<number, Record<string, number>> {
  const out = new Map<number, Record<string, number>>();
  for (const b of m.beads) for (const a of b.atoms) out.set(a.index, { ...out.get(a.index), [b.id]: a.weight });
  return out;
}

const same = (a: Record<string, number> = {}, b: Record<string, number> = {}) =>
  Object.keys(a).length === Object.keys(b).length && Object.entries(a).every(([k, w]) => b[k] === w);

const delta = (to: number | null | undefined, from: number | null | undefined) => (typeof to === 'number' && typeof from === 'number' ? to - from : null);

export function compareStates(from: MappingState, to: MappingState): Comparison {
  const before = new Map(from.draft.beads.map((b) => [b.id, b]));
  const after = new Map(to.draft.beads.map((b) => [b.id, b]));
  const evalOf = (e: Evaluation | null) => new Map<string, BeadEvaluation>(e?.beads.map((b) => [b.id, b]) ?? []);
  const evBefore = evalOf(from.evaluation);
  const evAfter = evalOf(to.evaluation);
  const both: [MappingBead, MappingBead][] = [];
  for (const [id, b] of after) if (before.has(id)) both.push([before.get(id)!, b]);

  const atomsBefore = membership(from.draft);
  const atomsAfter = membership(to.draft);
  const atoms = [...new Set([...atomsBefore.keys(), ...atomsAfter.keys()])].sort((x, y) => x - y);

  return {
    from: from.ref,
    to: to.ref,
    added: to.draft.beads.filter((b) => !before.has(b.id)).map((b) => ({ id: b.id, name: b.name })),
    removed: from.draft.beads.filter((b) => !after.has(b.id)).map((b) => ({ id: b.id, name: b.name })),
    renamed: both.filter(([a, b]) => a.name !== b.name).map(([a, b]) => ({ id: b.id, from: a.name, to: b.name })),
    retyped: both.filter(([a, b]) => (a.type ?? null) !== (b.type ?? null)).map(([a, b]) => ({ id: b.id, name: b.name, from: a.type ?? null, to: b.type ?? null })),
    recentred: both.filter(([a, b]) => a.centre !== b.centre).map(([a, b]) => ({ id: b.id, name: b.name, from: a.centre, to: b.centre })),
    moved: atoms.filter((i) => !same(atomsBefore.get(i), atomsAfter.get(i))).map((atom) => ({ atom, from: atomsBefore.get(atom) ?? {}, to: atomsAfter.get(atom) ?? {} })),
    deltas: both.map(([, b]) => {
      const x = evBefore.get(b.id);
      const y = evAfter.get(b.id);
      return { id: b.id, name: b.name, mass: delta(y?.mass, x?.mass), charge: delta(y?.charge, x?.charge), logP: delta(y?.logP, x?.logP), deltaG: delta(y?.deltaG, x?.deltaG), heavyAtoms: delta(y?.heavyAtoms, x?.heavyAtoms) };
    }),
  };
}
