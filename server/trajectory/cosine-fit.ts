/**
 * Least-squares fit of a dihedral potential by cosine terms n = 1…4:
 *   U(φ) ≈ c + Σₙ (aₙ cos nφ + bₙ sin nφ) = c + Σₙ kₙ cos(nφ − φₙ),  kₙ = √(aₙ² + bₙ²), φₙ = atan2(bₙ, aₙ)
 * written for the engines as Σₙ kₙ [1 + cos(nφ − φₙ)] (GROMACS proper dihedral type 9 / LAMMPS
 * "charmm" form; the constant differs only). Solved from the normal equations (9 unknowns) over the
 * bins where U is defined, by Gaussian elimination with partial pivoting; fewer terms when fewer
 * than nine bins are filled.
 */
export interface CosineTerm {
  n: number;
  /** kJ/mol */
  k: number;
  /** degrees */
  phase: number;
}

export function fitCosines(xDeg: number[], u: (number | null)[], upTo = 4): CosineTerm[] {
  // A narrow distribution fills few bins: fit only as many terms as the filled bins determine.
  const filled = u.filter((y) => y !== null && Number.isFinite(y)).length;
  const maxN = Math.min(upTo, Math.floor((filled - 1) / 2));
  if (maxN < 1) return [];
  const cols = 1 + 2 * maxN;
  const ata = Array.from({ length: cols }, () => new Array<number>(cols).fill(0));
  const atb = new Array<number>(cols).fill(0);
  let used = 0;
  const row = new Array<number>(cols);
  for (let i = 0; i < xDeg.length; i++) {
    const y = u[i];
    if (y === null || !Number.isFinite(y)) continue;
    used++;
    const phi = (xDeg[i] * Math.PI) / 180;
    row[0] = 1;
    for (let n = 1; n <= maxN; n++) {
      row[2 * n - 1] = Math.cos(n * phi);
      row[2 * n] = Math.sin(n * phi);
    }
    for (let r = 0; r < cols; r++) {
      atb[r] += row[r] * y;
      for (let c = 0; c < cols; c++) ata[r][c] += row[r] * row[c];
    }
  }
  if (used < cols) return [];
  const sol = solve(ata, atb);
  if (!sol) return [];
  const out: CosineTerm[] = [];
  for (let n = 1; n <= maxN; n++) {
    const a = sol[2 * n - 1];
    const b = sol[2 * n];
    out.push({ n, k: Math.hypot(a, b), phase: (Math.atan2(b, a) * 180) / Math.PI });
  }
  return out;
}

function solve(m: number[][], v: number[]): number[] | null {
  const n = v.length;
  const a = m.map((r, i) => [...r, v[i]]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r][c]) > Math.abs(a[p][c])) p = r;
    if (Math.abs(a[p][c]) < 1e-12) return null;
    [a[c], a[p]] = [a[p], a[c]];
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = a[r][c] / a[c][c];
      for (let k = c; k <= n; k++) a[r][k] -= f * a[c][k];
    }
  }
  return a.map((r, i) => r[n] / r[i]);
}
