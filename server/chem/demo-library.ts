/**
 * Beadloom's demo bead type library. INVENTED for the demo: the names, the bands and the ΔG_OW ranges
 * are ours, not any force field's parameters. Names are plain words for where a fragment goes between
 * water and octanol (water-loving 3 … middle … oil-loving 3), charged types are named by their sign
 * ("cation", "anion"), and the size class is its own column: the heavy atoms a bead of the type stands
 * for (4, 3 or 2). A type name must be unique in a library, so each name ends with its size in words
 * ("middle, 3 atoms"). The ranges (kJ/mol, positive = prefers octanol) only span the values a modeller
 * meets, so suggestions have something to choose from before a project defines its own library. The
 * open ends are ±1000 kJ/mol so the table survives JSON and CSV.
 */
import type { BeadType, SizeClass } from '../../src/shared/chem';

const BANDS: [string, number, number][] = [
  ['water-loving 3', -1000, -15],
  ['water-loving 2', -15, -8],
  ['water-loving 1', -8, -2],
  ['middle', -2, 4],
  ['oil-loving 1', 4, 10],
  ['oil-loving 2', 10, 16],
  ['oil-loving 3', 16, 1000],
];

export const DEMO_SIZE_CLASSES: readonly SizeClass[] = [4, 3, 2];
export const DEMO_LIBRARY_NOTE = 'Illustrative only: invented for the Beadloom demo (names, bands and ranges are ours), not any published force field’s bead types.';

const named = (band: string, size: SizeClass) => `${band}, ${size} atoms`;

function build(): BeadType[] {
  const out: BeadType[] = [];
  for (const heavyAtomsPerBead of DEMO_SIZE_CLASSES) {
    for (const [band, deltaGMin, deltaGMax] of BANDS) out.push({ name: named(band, heavyAtomsPerBead), heavyAtomsPerBead, charge: 0, deltaGMin, deltaGMax });
    out.push({ name: named('cation', heavyAtomsPerBead), heavyAtomsPerBead, charge: 1, deltaGMin: -1000, deltaGMax: 1000 });
    out.push({ name: named('anion', heavyAtomsPerBead), heavyAtomsPerBead, charge: -1, deltaGMin: -1000, deltaGMax: 1000 });
  }
  return out;
}

export const DEMO_LIBRARY: readonly BeadType[] = build();
