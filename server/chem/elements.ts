/** Element symbols in periodic-table order (IUPAC names and symbols), for atomic numbers. */
import { ChemError } from './errors';

const SYMBOLS =
  'H He Li Be B C N O F Ne Na Mg Al Si P S Cl Ar K Ca Sc Ti V Cr Mn Fe Co Ni Cu Zn Ga Ge As Se Br Kr Rb Sr Y Zr Nb Mo Tc Ru Rh Pd Ag Cd In Sn Sb Te I Xe Cs Ba La Ce Pr Nd Pm Sm Eu Gd Tb Dy Ho Er Tm Yb Lu Hf Ta W Re Os Ir Pt Au Hg Tl Pb Bi Po At Rn Fr Ra Ac Th Pa U Np Pu Am Cm Bk Cf Es Fm Md No Lr Rf Db Sg Bh Hs Mt Ds Rg Cn Nh Fl Mc Lv Ts Og'.split(' ');

const Z_OF = new Map(SYMBOLS.map((s, i) => [s, i + 1]));

/** Atomic number; 0 for an attachment point '*' (RDKit's dummy atom). */
export function atomicNumber(symbol: string): number {
  if (symbol === '*') return 0;
  const z = Z_OF.get(symbol);
  if (z === undefined) throw new ChemError('unsupported_atom', `${symbol} is not a chemical element.`, { element: symbol });
  return z;
}
