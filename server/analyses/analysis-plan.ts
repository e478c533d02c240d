/**
 * What an analysis computes, decided when it is started and stored with it (so a draft analysis stays
 * reproducible after the draft moves on): the mapping's beads with their centre weights and the CG
 * terms of its topology (bonds, angles, proper dihedrals; server/chem/topology.ts). A mapping with
 * unassigned heavy atoms or error-level checks cannot be analysed (422 naming them).
 */
import type { Evaluation, Mapping, Molecule } from '../../src/shared/chem';
import { prepare } from '../chem/prepared';
import { unprocessable } from '../http/errors';
import { beadWeights } from '../trajectory/bead-weights';
import type { TermKind } from '../trajectory/distributions';
import { moleculeGraph, spanningOrder } from '../trajectory/molecule-graph';

export interface AnalysisPlan {
  beads: { id: string; name: string; points: number[]; weights: number[] }[];
  terms: { kind: TermKind; beads: number[] }[];
  order: number[];
  via: number[];
}

export function planAnalysis(model: Molecule, draft: Mapping, evaluation: Evaluation | null): AnalysisPlan {
  if (!evaluation) throw unprocessable('mapping_not_evaluated', 'This state of the mapping has no evaluation to take its topology from; open it in the editor or save a new version.');
  const blocking = evaluation.checks.filter((c) => c.severity === 'error' || c.code === 'unassigned_atom');
  if (blocking.length) {
    throw unprocessable('mapping_not_ready', `The mapping cannot be applied to a reference yet: ${blocking.map((c) => c.message).join(' ')}`, {
      checks: blocking.map((c) => ({ code: c.code, message: c.message, atoms: c.atoms.map((a) => a + 1), beads: c.beads })),
    });
  }
  if (draft.beads.length === 0) throw unprocessable('mapping_not_ready', 'The mapping has no beads.');
  const p = prepare(model);
  const bw = beadWeights(p, draft);
  const index = new Map(draft.beads.map((b, i) => [b.id, i]));
  const at = (ids: string[]) => ids.map((id) => index.get(id)!);
  const { topology } = evaluation;
  const terms = [
    ...topology.bonds.map((b) => ({ kind: 'bond' as const, beads: at(b) })),
    ...topology.angles.map((a) => ({ kind: 'angle' as const, beads: at(a) })),
    ...topology.dihedrals.map((d) => ({ kind: 'dihedral' as const, beads: at(d) })),
  ].filter((t) => t.beads.every((i) => i !== undefined));
  const { order, via } = spanningOrder(moleculeGraph(model));
  return {
    beads: draft.beads.map((b, i) => ({ id: b.id, name: b.name, points: Array.from(bw.points[i]), weights: Array.from(bw.weights[i]) })),
    terms,
    order: Array.from(order),
    via: Array.from(via),
  };
}
