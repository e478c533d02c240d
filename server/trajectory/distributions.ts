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

/**
 * A term's distribution from values given in blocks, in two passes over the same blocks in the same
 * order (the values of a long trajectory live in a file, never whole in memory):
 *   pass 1 (add): the sum (or, for dihedrals, the sums of cos and sin), the smallest and largest value;
 *   pass 2 (addAgain): the squared deviations from the mean and the histogram.
 * Summing in the values' order makes the numbers the same as from one array in one piece.
 */
export class DistributionBuilder {
  private n = 0;
  private sum = 0;
  private sumCos = 0;
  private sumSin = 0;
  private lo = Infinity;
  private hi = -Infinity;
  private squares = 0;
  private range: [number, number] | null = null;
  private width = 0;
  private counts: number[];

  constructor(
    readonly kind: TermKind,
    readonly bins: number,
  ) {
    this.counts = new Array<number>(bins).fill(0);
  }

  add(values: ArrayLike<number>): void {
    const dihedral = this.kind === 'dihedral';
    for (let i = 0; i < values.length; i++) {
      const v = values[i];
      if (dihedral) {
        const r = (v * Math.PI) / 180;
        this.sumCos += Math.cos(r);
        this.sumSin += Math.sin(r);
      } else this.sum += v;
      if (v < this.lo) this.lo = v;
      if (v > this.hi) this.hi = v;
    }
    this.n += values.length;
  }

  /** The mean and sd (circular for dihedrals); the sd is known once pass 2 is done. */
  private mean(): number {
    return this.kind === 'dihedral' ? (Math.atan2(this.sumSin, this.sumCos) * 180) / Math.PI : this.sum / this.n;
  }

  private ensureRange(): [number, number] {
    if (!this.range) {
      this.range = rangeFor(this.kind, this.lo, this.hi);
      this.width = (this.range[1] - this.range[0]) / this.bins;
    }
    return this.range;
  }

  addAgain(values: ArrayLike<number>): void {
    const [lo, hi] = this.ensureRange();
    const { width, bins, counts } = this;
    const mean = this.mean();
    const linear = this.kind !== 'dihedral';
    for (let i = 0; i < values.length; i++) {
      const v = values[i];
      if (linear) this.squares += (v - mean) ** 2;
      let b = Math.floor((v - lo) / width);
      if (b === bins && v <= hi) b = bins - 1;
      if (b >= 0 && b < bins) counts[b]++;
    }
  }

  /** bond values in nm (k in kJ mol⁻¹ nm⁻²); angles and dihedrals in degrees (k in kJ mol⁻¹ rad⁻²). */
  finish(temperature: number): Distribution {
    const { kind, n } = this;
    const mean = this.mean();
    let sd: number;
    if (kind === 'dihedral') {
      const rBar = Math.min(1, Math.hypot(this.sumCos, this.sumSin) / n);
      sd = (Math.sqrt(-2 * Math.log(Math.max(rBar, 1e-300))) * 180) / Math.PI;
    } else sd = Math.sqrt(this.squares / Math.max(1, n - 1));
    const [lo] = this.ensureRange();
    const h: Histogram = { edges: Array.from({ length: this.bins + 1 }, (_, i) => lo + i * this.width), counts: this.counts };
    const sdInK = kind === 'bond' ? sd : (sd * Math.PI) / 180;
    const k = kind === 'dihedral' || !(sdInK > 0) ? null : kT(temperature) / (sdInK * sdInK);
    return { mean, sd, k, histogram: h, potential: invert(kind, h, temperature) };
  }
}

/** The histogram's range for a term: bonds their observed range (lo … hi, padded 2 %), angles 0–180°, dihedrals ±180°. */
export function rangeFor(kind: TermKind, lo: number, hi: number): [number, number] {
  if (kind === 'angle') return [0, 180];
  if (kind === 'dihedral') return [-180, 180];
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

/** A distribution of values in one array (DistributionBuilder with one block). */
export function distribution(kind: TermKind, values: ArrayLike<number>, temperature: number, bins: number): Distribution {
  const b = new DistributionBuilder(kind, bins);
  b.add(values);
  b.addAgain(values);
  return b.finish(temperature);
}
