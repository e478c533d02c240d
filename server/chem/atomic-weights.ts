/**
 * Standard atomic weights and isotope masses, our own table.
 *
 * Source: IUPAC Commission on Isotopic Abundances and Atomic Weights (CIAAW), "Standard atomic weights of
 * the elements 2021 (IUPAC Technical Report)", T. Prohaska et al., Pure Appl. Chem. 2022, 94, 573–600,
 * as listed on ciaaw.org. Where the standard atomic weight is an interval (H, Li, B, C, N, O, Mg, Si, S,
 * Cl, Ar, Br, Tl, Pb) the table holds CIAAW's conventional value. Every element with a standard atomic
 * weight is here (84: all of H–Bi except Tc and Pm, plus Th, Pa and U); elements without one (Tc, Pm,
 * Po–Ac, Np onwards) are refused by name. Values were written by hand from the published table (from
 * memory of it, except Tb, Ta and Gd, read on ciaaw.org; see docs/chemistry.md). Gd, Lu and Zr were
 * revised by CIAAW in 2024; this table keeps the 2021 values the product is specified on.
 *
 * Isotope masses (for labelled atoms such as [2H] or [13C]): Atomic Mass Evaluation 2020
 * (M. Wang et al., Chinese Phys. C 2021, 45, 030003), as quoted in the CIAAW isotope tables.
 *
 * Neither openchemlib's nor RDKit's built-in weights are used: both differ from CIAAW 2021 for several
 * elements (H, S, Se, Zn, I, B …).
 */
import { ChemError } from './errors';

export const STANDARD_ATOMIC_WEIGHTS: Readonly<Record<string, number>> = {
  H: 1.008, He: 4.002602, Li: 6.94, Be: 9.0121831, B: 10.81, C: 12.011, N: 14.007, O: 15.999,
  F: 18.998403162, Ne: 20.1797, Na: 22.98976928, Mg: 24.305, Al: 26.9815384, Si: 28.085,
  P: 30.973761998, S: 32.06, Cl: 35.45, Ar: 39.95, K: 39.0983, Ca: 40.078, Sc: 44.955907,
  Ti: 47.867, V: 50.9415, Cr: 51.9961, Mn: 54.938043, Fe: 55.845, Co: 58.933194, Ni: 58.6934,
  Cu: 63.546, Zn: 65.38, Ga: 69.723, Ge: 72.63, As: 74.921595, Se: 78.971, Br: 79.904, Kr: 83.798,
  Rb: 85.4678, Sr: 87.62, Y: 88.905838, Zr: 91.224, Nb: 92.90637, Mo: 95.95, Ru: 101.07,
  Rh: 102.90549, Pd: 106.42, Ag: 107.8682, Cd: 112.414, In: 114.818, Sn: 118.71, Sb: 121.76,
  Te: 127.6, I: 126.90447, Xe: 131.293, Cs: 132.90545196, Ba: 137.327, La: 138.90547,
  Ce: 140.116, Pr: 140.90766, Nd: 144.242, Sm: 150.36, Eu: 151.964, Gd: 157.25, Tb: 158.925354,
  Dy: 162.5, Ho: 164.930329, Er: 167.259, Tm: 168.934219, Yb: 173.045, Lu: 174.9668,
  Hf: 178.486, Ta: 180.94788, W: 183.84, Re: 186.207, Os: 190.23, Ir: 192.217, Pt: 195.084, Au: 196.96657,
  Hg: 200.592, Tl: 204.38, Pb: 207.2, Bi: 208.9804,
  Th: 232.0377, Pa: 231.03588, U: 238.02891,
};

/** Isotope masses (u) keyed `${massNumber}${symbol}`, AME2020. */
export const ISOTOPE_MASSES: Readonly<Record<string, number>> = {
  '1H': 1.00782503223, '2H': 2.01410177812, '3H': 3.0160492779,
  '12C': 12, '13C': 13.00335483507, '14C': 14.0032419884,
  '14N': 14.00307400443, '15N': 15.00010889888,
  '16O': 15.99491461957, '17O': 16.9991317565, '18O': 17.99915961286,
  '19F': 18.99840316273, '18F': 18.0009380,
  '31P': 30.97376199842, '32S': 31.9720711744, '34S': 33.967867004,
  '35Cl': 34.968852682, '37Cl': 36.965902602, '79Br': 78.9183376, '81Br': 80.9162897,
  '123I': 122.905589, '125I': 124.9046294, '127I': 126.9044719, '131I': 130.9061263,
};

export function atomicWeight(element: string): number {
  const w = STANDARD_ATOMIC_WEIGHTS[element];
  if (w === undefined) {
    throw new ChemError(
      'element_not_in_mass_table',
      `No standard atomic weight for element ${element} in Beadloom's table; its mass cannot be computed.`,
      { element },
    );
  }
  return w;
}

/** Mass of an atom: its isotope's mass when labelled, else the element's standard atomic weight. */
export function atomMass(element: string, isotope: number | null): number {
  if (element === '*') return 0; // an attachment point: where the next unit joins, no atom of its own
  if (isotope === null) return atomicWeight(element);
  const m = ISOTOPE_MASSES[`${isotope}${element}`];
  if (m === undefined) {
    throw new ChemError(
      'isotope_not_in_mass_table',
      `No mass for isotope ${isotope}${element} in Beadloom's table.`,
      { element, isotope },
    );
  }
  return m;
}
