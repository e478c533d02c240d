/**
 * Attachment points and query atoms in an uploaded molfile, before openchemlib reads it.
 *
 * A molfile marks where a repeat unit or end group joins the next unit with an atom whose symbol is
 * `*` (V2000 and V3000), `R` or `R#` (an R-group, with `M  RGP` lines in V2000 or `RGROUPS=` in V3000;
 * BIOVIA "CTfile Formats"). openchemlib reads `*` as a query atom and then drops every implicit hydrogen
 * of the molecule, and refuses `R`/`R#` as no element; so, as for `*` in a SMILES (parse.ts), each such
 * atom is handed to openchemlib as the placeholder element rutherfordium, which model.ts turns into an
 * attachment point: its own kind of atom, massless, not a heavy atom, its neighbour's hydrogens intact.
 * The R-group bookkeeping (which substituent an R stands for) is dropped with it: Beadloom models the
 * unit itself. A real Rf atom is refused here (it has no standard atomic weight and the placeholder
 * must stay unambiguous). Other query atoms (`A`, `Q`, `L`, `X`, `M` and their `H` forms, atom lists
 * `[C,N]`, `NOT[...]`) describe a family of molecules, not one: refused as `query_not_supported`.
 */
import type { Molecule } from 'openchemlib';
import { ChemError } from './errors';

const ATTACHMENT_SYMBOLS = new Set(['*', 'R', 'R#']);
const QUERY_SYMBOLS = new Set(['A', 'AH', 'Q', 'QH', 'L', 'X', 'XH', 'M', 'MH']);
/** V2000 atom line: x, y, z, then the symbol (columns 32–34 in a well-formed file; spacing is not trusted). */
const V2000_ATOM = /^(\s*-?\d+(?:\.\d+)?\s+-?\d+(?:\.\d+)?\s+-?\d+(?:\.\d+)?\s)(\S+)(\s*)/;
/** V3000 atom line: `M  V30 index type x y z …`. */
const V3000_ATOM = /^(M {2}V30\s+\d+\s+)(\S+)(\s)/;

export interface MolfileAttachments {
  /** The molfile with every attachment atom written as the placeholder `Rf`. */
  text: string;
  /** 1-based molfile atom numbers of the attachment points. */
  atoms: number[];
}

export function placeMolfileAttachments(text: string): MolfileAttachments {
  const lines = text.split('\n');
  const atoms: number[] = [];
  const symbolAt = (line: number, atom: number, pattern: RegExp): void => {
    const m = pattern.exec(lines[line]);
    if (!m) return;
    const symbol = m[2];
    if (symbol === 'Rf') throw new ChemError('unsupported_atom', `Atom ${atom} (Rf) is not a chemical element Beadloom can weigh.`, { atom });
    if (QUERY_SYMBOLS.has(symbol) || symbol.startsWith('[') || symbol.startsWith('NOT')) {
      throw new ChemError('query_not_supported', `Atom ${atom} ("${symbol}") is a query atom, not an atom of a molecule; only "*", "R" and "R#" are read, as attachment points.`, { atom, symbol });
    }
    if (!ATTACHMENT_SYMBOLS.has(symbol)) return;
    atoms.push(atom);
    // Same width as before where there is room, so the fixed columns of a V2000 line stay where they were.
    lines[line] = `${m[1]}Rf${' '.repeat(Math.max(1, symbol.length + m[3].length - 2))}${lines[line].slice(m[0].length)}`;
  };
  const v3 = lines.findIndex((l) => l.startsWith('M  V30 BEGIN ATOM'));
  if (v3 >= 0) {
    for (let i = v3 + 1, atom = 1; i < lines.length && !lines[i].startsWith('M  V30 END ATOM'); i++) {
      if (lines[i - 1].endsWith('-')) continue; // a continuation line
      symbolAt(i, atom++, V3000_ATOM);
    }
    if (atoms.length) for (let i = v3 + 1; i < lines.length; i++) lines[i] = lines[i].replace(/\s+RGROUPS=\([^)]*\)/, '');
  } else {
    const count = Number((lines[3] ?? '').slice(0, 3));
    for (let k = 0; k < count; k++) symbolAt(4 + k, k + 1, V2000_ATOM);
    if (lines.some((l) => l.startsWith('M  ALS'))) {
      throw new ChemError('query_not_supported', 'The molfile holds an atom list (M  ALS), a query for a family of molecules, not one molecule.', {});
    }
  }
  const kept = atoms.length ? lines.filter((l) => !l.startsWith('M  RGP')) : lines;
  return { text: kept.join('\n'), atoms };
}

/** Query features left after the symbols (a query bond type, query atom flags): openchemlib marks the molecule a fragment. */
export function refuseMolfileQuery(mol: Molecule): void {
  if (mol.isFragment()) {
    throw new ChemError('query_not_supported', 'The molfile holds query features (a query atom or bond type), which describe a family of molecules, not one molecule.', {});
  }
}
