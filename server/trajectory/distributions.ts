/**
 * Distributions of CG bonded terms and their Boltzmann inversion.
 *
 *   U(r) = −kT ln[P(r)/r²]      (bonds; r² is the Jacobian of the radial volume element)
 *   U(θ) = −kT ln[P(θ)/sin θ]   (angles; sin θ the Jacobian of the solid angle)
 *   U(φ) = −kT ln P(φ)          (dihedrals)
 *   k_b = kT/σ_r²,  k_θ = kT/σ_θ² (σ_θ in radians)
 *
 * (Tschöp, Kremer, Batoulis, Bürger & Hahn, Acta Polym. 1998, 49, 61; Reith, Pütz & Müller-Plathe,
 * J. Comput. Chem. 2003, 24, 1624.) The harmonic constants are the ones whose Boltzmann distribution
 * has the observed variance. kT in kJ/mol with R = 8.314462618 J mol⁻¹ K⁻¹ (CODATA 2018). U is
 * shifted so its minimum is 0 and left out (null) where a bin is empty. Dihedral mean and sd are
 * circular (Mardia & Jupp, Directional Statistics, 2000: mean direction and √(−2 ln R̄)).
 */
export const R_KJ = 8.314462618e-3;

export type TermKind = 'bond' | 'angle' | 'dihedral';

export interface Histogram {
  edges: number[];
  counts: number[];
}

export interface Distribution {
  mean: number;
  sd: number;
  k: number | null;
  histogram: Histogram;
  potential: { x: number[]; u: (number | null)[] };
}

export function kT(temperature: number): number {
  return R_KJ * temperature;
}

export function meanSd(values: ArrayLike<number>): { mean: number; sd: number } {
  let s = 0;
  for (let i = 0; i < values.length; i++) s += values[i];
  const mean = s / values.length;
  let v = 0;
  for (let i = 0; i < values.length; i++) v += (values[i] - mean) ** 2;
  return { mean, sd: Math.sqrt(v / Math.max(1, values.length - 1)) };
}

/** Degrees in, degrees out. */
export function circularMeanSd(values: ArrayLike<number>): { mean: number; sd: number } {
  let c = 0;
  let s = 0;
  for (let i = 0; i < values.length; i++) {
    const r = (values[i] * Math.PI) / 180;
    c += Math.cos(r);
    s += Math.sin(r);
  }
  const rBar = Math.min(1, Math.hypot(c, s) / values.length);
  return { mean: (Math.atan2(s, c) * 180) / Math.PI, sd: (Math.sqrt(-2 * Math.log(Math.max(rBar, 1e-300))) * 180) / Math.PI };
}

export function histogram(values: ArrayLike<number>, lo: number, hi: number, bins: number): Histogram {
  const width = (hi - lo) / bins;
  const counts = new Array<number>(bins).fill(0);
  for (let i = 0; i < values.length; i++) {
    let b = Math.floor((values[i] - lo) / width);
    if (b === bins && values[i] <= hi) b = bins - 1;
    if (b >= 0 && b < bins) counts[b]++;
  }
  return { edges: Array.from({ length: bins + 1 }, (_, i) => lo + i * width), counts };
}

/** The histogram's range for a term: bonds their observed range, angles 0–180°, dihedrals ±180°. */
export function rangeOf(kind: TermKind, values: ArrayLike<number>): [number, number] {
  if (kind === 'angle') return [0, 180];
  if (kind === 'dihedral') return [-180, 180];
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    if (values[i] < lo) lo = values[i];
    if (values[i] > hi) hi = values[i];
  }
  if (!(hi > lo)) return [Math.max(0, lo - 0.01), hi + 0.01];
  const pad = (hi - lo) * 0.02;
  return [Math.max(0, lo - pad), hi + pad];
}

/** Boltzmann-inverted potential at the bin centres (kJ/mol), minimum shifted to 0. */
export function invert(kind: TermKind, h: Histogram, temperature: number): { x: number[]; u: (number | null)[] } {
  const total = h.counts.reduce((s, c) => s + c, 0) || 1;
  const x: number[] = [];
  const raw: (number | null)[] = [];
  for (let b = 0; b < h.counts.length; b++) {
    const centre = (h.edges[b] + h.edges[b + 1]) / 2;
    const width = h.edges[b + 1] - h.edges[b];
    x.push(centre);
    const p = h.counts[b] / total / width;
    const jacobian = kind === 'bond' ? centre * centre : kind === 'angle' ? Math.sin((centre * Math.PI) / 180) : 1;
    raw.push(p > 0 && jacobian > 0 ? -kT(temperature) * Math.log(p / jacobian) : null);
  }
  let min = Infinity;
  for (const u of raw) if (u !== null && u < min) min = u;
  return { x, u: raw.map((u) => (u === null ? null : u - min)) };
}

/** bond values in nm (k in kJ mol⁻¹ nm⁻²); angles and dihedrals in degrees (k in kJ mol⁻¹ rad⁻²). */
export function distribution(kind: TermKind, values: ArrayLike<number>, temperature: number, bins: number): Distribution {
  const { mean, sd } = kind === 'dihedral' ? circularMeanSd(values) : meanSd(values);
  const sdInK = kind === 'bond' ? sd : (sd * Math.PI) / 180;
  const k = kind === 'dihedral' || !(sdInK > 0) ? null : kT(temperature) / (sdInK * sdInK);
  const [lo, hi] = rangeOf(kind, values);
  const h = histogram(values, lo, hi, bins);
  return { mean, sd, k, histogram: h, potential: invert(kind, h, temperature) };
}
