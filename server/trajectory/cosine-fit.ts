/**
 * Least-squares fit of a dihedral potential by cosine terms n = 1…4:
 *   U(φ) ≈ c + Σₙ (aₙ cos nφ + bₙ sin nφ) = c + Σₙ kₙ cos(nφ − φₙ),  kₙ = √(aₙ² + bₙ²), φₙ = atan2(bₙ, aₙ)
 * written for the engines as Σₙ kₙ [1 + cos(nφ − φₙ)] (GROMACS proper dihedral type 9 / LAMMPS
 * "charmm" form; the constant differs only). Solved from the normal equations (9 unknowns) over the
 * bins where U is defined, by Gaussian elimination with partial pivoting.
 *
 * Terms up to n need 2n + 1 unknowns (the constant, a cos and a sin per n), so at least 2n + 1
 * filled bins: with fewer than nine, fewer than four terms are fitted. Bins filled side by side over
 * a narrow range may also leave the equations for the higher terms singular; then fewer are fitted
 * too. Either way the result says which and why (fitCosineSeries: fitted n, filled bins, a note)
 * rather than silently returning fewer.
 */
export interface CosineTerm {
  n: number;
  /** kJ/mol */
  k: number;
  /** degrees */
  phase: number;
}

export interface CosineSeries {
  terms: CosineTerm[];
  /** Bins where U is defined (the points fitted). */
  filledBins: number;
  /** The terms asked for: n = 1 … upTo. */
  upTo: number;
  /** Why fewer than upTo terms were fitted; null when all were. */
  note: string | null;
}

export function fitCosines(xDeg: number[], u: (number | null)[], upTo = 4): CosineTerm[] {
  return fitCosineSeries(xDeg, u, upTo).terms;
}

export function fitCosineSeries(xDeg: number[], u: (number | null)[], upTo = 4): CosineSeries {
  // A narrow distribution fills few bins: fit only as many terms as the filled bins determine.
  const filled = u.filter((y) => y !== null && Number.isFinite(y)).length;
  const maxN = Math.min(upTo, Math.floor((filled - 1) / 2));
  const series = (terms: CosineTerm[], note: string | null): CosineSeries => ({ terms, filledBins: filled, upTo, note });
  const few = `Only ${filled} histogram bin${filled === 1 ? ' is' : 's are'} filled; cosine terms up to n need at least 2n + 1 filled bins`;
  if (maxN < 1) return series([], `${few}, so no term was fitted (n = 1 needs 3).`);
  // Bins filled side by side over a narrow range may not tell higher terms apart (singular normal
  // equations): then fit fewer, down to n = 1.
  let n = maxN;
  let terms = solveSeries(xDeg, u, n);
  while (!terms && n > 1) terms = solveSeries(xDeg, u, --n);
  const ns = (a: number, b: number) => (a === b ? `n = ${a} was` : `n = ${a}…${b} were`);
  if (!terms) return series([], `The ${filled} filled bins span too narrow a range to fit even n = 1 (the least-squares equations are singular), so no term was fitted.`);
  if (n === upTo) return series(terms, null);
  if (n === maxN) return series(terms, `${few}, so ${ns(1, n)} fitted and ${ns(n + 1, upTo)} not.`);
  return series(terms, `The ${filled} filled bins span too narrow a range to tell terms beyond n = ${n} apart (the least-squares equations for more are singular), so ${ns(1, n)} fitted and ${ns(n + 1, upTo)} not.`);
}

function solveSeries(xDeg: number[], u: (number | null)[], maxN: number): CosineTerm[] | null {
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
  if (used < cols) return null;
  const sol = solve(ata, atb);
  if (!sol) return null;
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
