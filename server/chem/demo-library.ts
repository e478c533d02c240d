/**
 * Beadloom's demo bead type library. INVENTED for the demo: the names and ΔG_OW ranges are ours, not
 * any force field's parameters. They only span the range of values a modeller meets (from strongly
 * water-loving to strongly octanol-loving, kJ/mol, positive = prefers octanol), so suggestions have
 * something to choose from before a project defines its own library. The open ends are ±1000 kJ/mol so
 * the table survives JSON.
 */
import type { BeadType, SizeClass } from '../../src/shared/chem';

const BANDS: [string, number, number][] = [
  ['W3', -1000, -15],
  ['W2', -15, -8],
  ['W1', -8, -2],
  ['M0', -2, 4],
  ['L1', 4, 10],
  ['L2', 10, 16],
  ['L3', 16, 1000],
];

const PREFIX: Record<SizeClass, string> = { regular: '', small: 's', tiny: 't' };

function build(): BeadType[] {
  const out: BeadType[] = [];
  for (const sizeClass of ['regular', 'small', 'tiny'] as const) {
    for (const [name, deltaGMin, deltaGMax] of BANDS) out.push({ name: `${PREFIX[sizeClass]}${name}`, sizeClass, charge: 0, deltaGMin, deltaGMax });
    out.push({ name: `${PREFIX[sizeClass]}Q+`, sizeClass, charge: 1, deltaGMin: -1000, deltaGMax: 1000 });
    out.push({ name: `${PREFIX[sizeClass]}Q-`, sizeClass, charge: -1, deltaGMin: -1000, deltaGMax: 1000 });
  }
  return out;
}

export const DEMO_LIBRARY: readonly BeadType[] = build();
