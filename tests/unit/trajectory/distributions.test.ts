import { describe, expect, it } from 'vitest';
import { distribution, DistributionBuilder, kT, type TermKind } from '../../../server/trajectory/distributions';
import { fitCosines, fitCosineSeries } from '../../../server/trajectory/cosine-fit';
import { angle, dihedral } from '../../../server/trajectory/geometry';

// Boltzmann inversion and harmonic constants on synthetic distributions of known width.
// Harmonic constant k = kT/σ² for a Gaussian of variance σ² (Tschöp et al., Acta Polym. 1998, 49, 61;
// Reith, Pütz & Müller-Plathe, J. Comput. Chem. 2003, 24, 1624). R = 8.314462618 J/(mol K) (CODATA 2018).

function gaussians(n: number, mean: number, sd: number, seed = 1): Float64Array {
  let s = seed;
  const r = () => ((s = (s * 16807) % 2147483647) / 2147483647);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = mean + sd * Math.sqrt(-2 * Math.log(r())) * Math.cos(2 * Math.PI * r());
  return out;
}

describe('distributions', () => {
  it('kT at 298.15 K is 2.4790 kJ/mol (CODATA 2018 R)', () => {
    expect(kT(298.15)).toBeCloseTo(2.47897, 4);
  });

  it('a Gaussian bond of known σ gives k within 2% of kT/σ²', () => {
    const sigma = 0.01; // nm
    const d = distribution('bond', gaussians(200_000, 0.47, sigma), 300, 100);
    const expected = kT(300) / sigma ** 2;
    expect(Math.abs(d.k! - expected) / expected).toBeLessThan(0.02);
    expect(d.mean).toBeCloseTo(0.47, 4);
  });

  it('a Gaussian angle of known σ gives k_θ within 2% of kT/σ² with σ in radians', () => {
    const sigmaDeg = 8;
    const d = distribution('angle', gaussians(200_000, 120, sigmaDeg, 7), 298.15, 180);
    const expected = kT(298.15) / ((sigmaDeg * Math.PI) / 180) ** 2;
    expect(Math.abs(d.k! - expected) / expected).toBeLessThan(0.02);
  });

  it('the bond potential has the r² Jacobian: a Gaussian in r inverts to a harmonic well near the mean', () => {
    const sigma = 0.02;
    const d = distribution('bond', gaussians(400_000, 0.5, sigma, 3), 300, 60);
    // U(r) = −kT ln P(r) + 2 kT ln r + const: the Jacobian moves the minimum below the mean by about 2σ²/r.
    let best = 0;
    d.potential.u.forEach((u, i) => {
      if (u !== null && u < (d.potential.u[best] ?? Infinity)) best = i;
    });
    expect(d.potential.x[best]).toBeLessThan(0.5);
    expect(d.potential.x[best]).toBeGreaterThan(0.5 - 3 * (2 * sigma ** 2) / 0.5 - 0.01);
  });

  it('built block by block (as from the values file of a long trajectory), a distribution is the same to the last bit', () => {
    // The analysis never holds all values: DistributionBuilder reads them in blocks, twice. Summing in
    // the same order must give exactly what one array gives (hand-made check, no outside source).
    const cases: [TermKind, Float64Array][] = [
      ['bond', gaussians(50_001, 0.47, 0.01, 5)],
      ['angle', gaussians(50_001, 120, 9, 6)],
      ['dihedral', gaussians(50_001, 170, 25, 8).map((v) => v - 360 * Math.round(v / 360))],
    ];
    for (const [kind, values] of cases) {
      const whole = distribution(kind, values, 298.15, 90);
      const b = new DistributionBuilder(kind, 90);
      for (const pass of [0, 1]) {
        for (let at = 0; at < values.length; at += 7_777) {
          const block = values.subarray(at, at + 7_777);
          if (pass === 0) b.add(block);
          else b.addAgain(block);
        }
      }
      expect(b.finish(298.15), kind).toEqual(whole);
    }
  });

  it('cosine fit recovers the terms of a known dihedral potential (hand-made series)', () => {
    const x = Array.from({ length: 72 }, (_, i) => -177.5 + 5 * i);
    const u = x.map((p) => 3 * (1 + Math.cos((p * Math.PI) / 180)) + 1.5 * (1 + Math.cos((3 * p * Math.PI) / 180 - Math.PI / 2)));
    const fit = fitCosines(x, u);
    expect(fit[0].k).toBeCloseTo(3, 6);
    expect(fit[0].phase).toBeCloseTo(0, 4);
    expect(fit[2].k).toBeCloseTo(1.5, 6);
    expect(fit[2].phase).toBeCloseTo(90, 4);
    expect(fit[1].k).toBeCloseTo(0, 6);
  });
});

describe('cosine fit with few filled bins', () => {
  // Hand-worked: terms up to n have 2n + 1 unknowns (constant, cos and sin per n), so 5 filled bins
  // determine n = 1, 2 at most; 2 filled bins determine none. The result must say so.
  const x = Array.from({ length: 72 }, (_, i) => -177.5 + 5 * i);
  const narrow = (filled: number) => x.map((p, i) => (i >= 30 && i < 30 + filled ? 0.02 * (p - x[30]) ** 2 : null));

  it('all four terms and no note when nine or more bins are filled around the circle', () => {
    const spread = x.map((p, i) => (i % 8 === 0 ? 1 + Math.cos((p * Math.PI) / 180) : null));
    const fit = fitCosineSeries(x, spread);
    expect(fit.terms.map((t) => t.n)).toEqual([1, 2, 3, 4]);
    expect(fit).toMatchObject({ filledBins: 9, upTo: 4, note: null });
  });

  it('nine neighbouring bins (40°) do not tell four terms apart: fewer are fitted, and the note says why', () => {
    const fit = fitCosineSeries(x, narrow(9));
    expect(fit.terms.length).toBeGreaterThan(0);
    expect(fit.terms.length).toBeLessThan(4);
    const n = fit.terms.length;
    expect(fit.note).toBe(`The 9 filled bins span too narrow a range to tell terms beyond n = ${n} apart (the least-squares equations for more are singular), so ${n === 1 ? 'n = 1 was' : `n = 1…${n} were`} fitted and ${n === 3 ? 'n = 4 was' : `n = ${n + 1}…4 were`} not.`);
  });

  it('five filled bins: n = 1…2 fitted, and the note says why 3 and 4 were not', () => {
    const fit = fitCosineSeries(x, narrow(5));
    expect(fit.terms.map((t) => t.n)).toEqual([1, 2]);
    expect(fit.filledBins).toBe(5);
    expect(fit.note).toBe('Only 5 histogram bins are filled; cosine terms up to n need at least 2n + 1 filled bins, so n = 1…2 were fitted and n = 3…4 were not.');
  });

  it('seven filled bins: n = 4 alone is left out; two bins: nothing is fitted, and it says so', () => {
    expect(fitCosineSeries(x, narrow(7)).note).toBe('Only 7 histogram bins are filled; cosine terms up to n need at least 2n + 1 filled bins, so n = 1…3 were fitted and n = 4 was not.');
    const none = fitCosineSeries(x, narrow(2));
    expect(none.terms).toEqual([]);
    expect(none.note).toBe('Only 2 histogram bins are filled; cosine terms up to n need at least 2n + 1 filled bins, so no term was fitted (n = 1 needs 3).');
  });
});

describe('geometry', () => {
  it('the dihedral follows the IUPAC sign convention (IUPAC Gold Book, torsion angle)', () => {
    // Looking from atom 2 to atom 3 (along +z), atom 4 is 90° clockwise from atom 1: +90°.
    const c = Float64Array.from([1, 0, 0, 0, 0, 0, 0, 0, 1, 0, 1, 1]);
    expect(dihedral(c, 0, 1, 2, 3)).toBeCloseTo(90, 10);
    const trans = Float64Array.from([1, 0, 0, 0, 0, 0, 0, 0, 1, -1, 0, 1]);
    expect(Math.abs(dihedral(trans, 0, 1, 2, 3))).toBeCloseTo(180, 10);
    expect(angle(c, 0, 1, 2)).toBeCloseTo(90, 10);
  });
});
