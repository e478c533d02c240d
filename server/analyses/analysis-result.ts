// From each term's distribution to the stored result: rounded numbers, bead names and ids, and, for
// dihedrals, the cosine fit (cosine-fit.ts).
import type { AnalysisResult, Term } from '../../src/shared/references';
import { fitCosineSeries } from '../trajectory/cosine-fit';
import type { Distribution } from '../trajectory/distributions';
import type { AnalysisPlan } from './analysis-plan';

const round = (v: number, digits = 6) => (Number.isFinite(v) ? Number(v.toPrecision(digits)) : v);

/** distributions[i]: the distribution of plan.terms[i] (analysis-run.ts builds them from the values file). */
export function buildResult(plan: AnalysisPlan, distributions: Distribution[], frames: number, copies: number): AnalysisResult {
  const out: AnalysisResult = { frames, copies, beads: plan.beads.map((b) => ({ id: b.id, name: b.name })), bonds: [], angles: [], dihedrals: [] };
  plan.terms.forEach((t, i) => {
    const d = distributions[i];
    const term: Term = {
      beads: t.beads.map((b) => plan.beads[b].name),
      beadIds: t.beads.map((b) => plan.beads[b].id),
      mean: round(d.mean),
      sd: round(d.sd),
      k: d.k === null ? null : round(d.k),
      histogram: { edges: d.histogram.edges.map((e) => round(e)), counts: d.histogram.counts },
      potential: { x: d.potential.x.map((x) => round(x)), u: d.potential.u.map((u) => (u === null ? null : round(u))) },
    };
    if (t.kind === 'dihedral') {
      const fit = fitCosineSeries(d.potential.x, d.potential.u);
      term.fourier = fit.terms.map((f) => ({ n: f.n, k: round(f.k), phase: round(f.phase) }));
      term.fourierFit = { fitted: fit.terms.map((f) => f.n), filledBins: fit.filledBins, note: fit.note };
    }
    (t.kind === 'bond' ? out.bonds : t.kind === 'angle' ? out.angles : out.dihedrals).push(term);
  });
  return out;
}
