/**
 * Filling the bonded-terms table from a finished reference analysis (docs/exports.md, "Filling from
 * an analysis"). Pure: the server applies it to the draft in one transaction and the editor uses it to
 * say beforehand what a fill will replace. The analysis's stored numbers are taken as they are
 * (server/trajectory/distributions.ts computed them):
 *   bond      value = mean length (nm),  k = kT/σ_r² (kJ mol⁻¹ nm⁻²), function harmonic
 *   angle     value = mean angle (°),    k = kT/σ_θ², σ_θ in radians (kJ mol⁻¹ rad⁻²), function harmonic
 *   dihedral  the dominant term of the stored cosine fit U(φ) ≈ Σ kₙ[1 + cos(nφ − φₙ)]: the n with the
 *             largest kₙ gives multiplicity n, k = kₙ (kJ mol⁻¹) and phase φₙ rounded to whole degrees
 *             (LAMMPS' charmm dihedral takes whole degrees; the other terms of the fit are not kept)
 * A row keeps its own constraint and leave-out choices (ring handling is the modeller's decision);
 * impropers are never touched. Terms are matched by bead names, in either direction.
 */
import { bondedParamsProblem, type BondedParams, type BondedTerm, type TermKind } from './bonded-terms';

/** The part of an analysis result a fill reads (src/shared/references.ts, Term). */
export interface FittedTerm {
  beads: string[];
  mean: number;
  k: number | null;
  fourier?: { n: number; k: number; phase: number }[];
}
export interface FittedTerms {
  bonds: FittedTerm[];
  angles: FittedTerm[];
  dihedrals: FittedTerm[];
}

export interface FillTermRef {
  kind: TermKind;
  beads: string[];
}

/** What a fill did, sent with the table: rows filled, analysis terms not used (why), rows left as they were. */
export interface FillReport {
  analysisId: number;
  filled: FillTermRef[];
  skipped: (FillTermRef & { reason: string })[];
  missing: FillTermRef[];
}

export interface FillPlan {
  /** Row index (in the rows given) → the params it gets. */
  updates: { row: number; params: BondedParams }[];
  filled: FillTermRef[];
  skipped: (FillTermRef & { reason: string })[];
  missing: FillTermRef[];
}

const nameKey = (kind: TermKind, beads: readonly string[]) => {
  const forward = beads.join('\u0000');
  const backward = [...beads].reverse().join('\u0000');
  return `${kind}|${forward < backward ? forward : backward}`;
};

/** The params a fitted term gives a row, or why it cannot. */
export function fittedParams(kind: 'bond' | 'angle' | 'dihedral', t: FittedTerm, row: Pick<BondedTerm, 'constraint' | 'omit'>): BondedParams | string {
  let params: BondedParams;
  if (kind === 'dihedral') {
    const fit = t.fourier ?? [];
    if (fit.length === 0) return 'The analysis has no cosine fit for this dihedral (too few filled bins).';
    const top = fit.reduce((best, f) => (f.k > best.k ? f : best));
    params = { function: 'periodic', value: Math.round(top.phase) === 0 ? 0 : Math.round(top.phase), k: top.k, multiplicity: top.n };
  } else {
    if (t.k === null) return 'The analysis found no spread in this term, so no force constant.';
    params = { function: 'harmonic', value: t.mean, k: t.k };
  }
  if (kind === 'bond' && row.constraint) params.constraint = true;
  if (kind !== 'bond' && row.omit) params.omit = true;
  const why = bondedParamsProblem(kind, params);
  return why ? `The fitted values cannot be used: ${why}` : params;
}

/** Matches the table's rows with the analysis's terms by bead names and works out each row's new params. */
export function planFill(rows: readonly BondedTerm[], fitted: FittedTerms): FillPlan {
  const byKey = new Map<string, number[]>();
  rows.forEach((r, i) => {
    if (r.kind === 'improper') return;
    const k = nameKey(r.kind, r.beads);
    byKey.set(k, [...(byKey.get(k) ?? []), i]);
  });
  const plan: FillPlan = { updates: [], filled: [], skipped: [], missing: [] };
  const used = new Set<number>();
  const groups: ['bond' | 'angle' | 'dihedral', FittedTerm[]][] = [['bond', fitted.bonds], ['angle', fitted.angles], ['dihedral', fitted.dihedrals]];
  for (const [kind, terms] of groups) {
    for (const t of terms) {
      const ref = { kind, beads: t.beads };
      const at = byKey.get(nameKey(kind, t.beads)) ?? [];
      if (at.length === 0) {
        plan.skipped.push({ ...ref, reason: `The draft's topology has no ${kind} ${t.beads.join('–')}.` });
        continue;
      }
      if (at.length > 1) {
        plan.skipped.push({ ...ref, reason: `${at.length} ${kind}s of the draft have these bead names; rename the beads apart first.` });
        at.forEach((i) => used.add(i));
        continue;
      }
      const params = fittedParams(kind, t, rows[at[0]]);
      used.add(at[0]);
      if (typeof params === 'string') {
        plan.skipped.push({ ...ref, reason: params });
        continue;
      }
      plan.updates.push({ row: at[0], params });
      plan.filled.push({ kind, beads: rows[at[0]].beads });
    }
  }
  rows.forEach((r, i) => {
    if (r.kind !== 'improper' && !used.has(i)) plan.missing.push({ kind: r.kind, beads: r.beads });
  });
  return plan;
}

/** PUT { fromAnalysis } answers the table as it is now, with what the fill did. */
export interface BondedFillView {
  terms: BondedTerm[];
  exclusions: number | null;
  fill: FillReport;
}
