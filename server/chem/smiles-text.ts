/**
 * A SMILES string's text, checked before any toolkit reads it.
 *
 * openchemlib stops quietly at what it does not understand: `CC(C` is read as propane, `CCO\0CC` as
 * ethanol, `éc1ccccc1` as benzene. This module walks the whole string with the grammar of OpenSMILES
 * (http://opensmiles.org/opensmiles.html, sections 3.1–3.6) and refuses, with a 1-based character
 * position, anything that is not a complete SMILES:
 * - characters outside printable ASCII (control characters such as NUL, letters with accents, emoji);
 * - an unclosed branch or ring bond, a `)` without `(`, a bond or `.` with no atom after it;
 * - query features of SMARTS (`~`, `!`, `;`, `,`, `&`, `@` as a bond, `[#6]`, `[C;H2]`, `[R]` …): a
 *   query is not a molecule. The one exception is `*` (also `[*]`, `[1*]`, `[*:2]`), read as an
 *   attachment point of a repeat unit or end group (see docs/chemistry.md);
 * - CXSMILES extensions (` |…|` after the SMILES): they can carry radicals, coordination bonds and
 *   attachment labels that Beadloom would silently drop, so they are refused with a hint.
 * Aromatic `te` (an RDKit extension to OpenSMILES) is accepted here; see parse.ts.
 */
import { firstBadSmilesCharacter } from '../../src/shared/smiles-text';
import { ChemError } from './errors';

const ELEMENTS = new Set(
  'H He Li Be B C N O F Ne Na Mg Al Si P S Cl Ar K Ca Sc Ti V Cr Mn Fe Co Ni Cu Zn Ga Ge As Se Br Kr Rb Sr Y Zr Nb Mo Tc Ru Rh Pd Ag Cd In Sn Sb Te I Xe Cs Ba La Ce Pr Nd Pm Sm Eu Gd Tb Dy Ho Er Tm Yb Lu Hf Ta W Re Os Ir Pt Au Hg Tl Pb Bi Po At Rn Fr Ra Ac Th Pa U Np Pu Am Cm Bk Cf Es Fm Md No Lr Rf Db Sg Bh Hs Mt Ds Rg Cn Nh Fl Mc Lv Ts Og'.split(' '),
);
const AROMATIC_IN_BRACKETS = new Set(['b', 'c', 'n', 'o', 'p', 's', 'se', 'as', 'te']);
const ORGANIC = /^(Cl|Br|[BCNOPSFIbcnops*])/;
// OpenSMILES bracket atom: isotope? symbol chiral? hcount? charge? class?
const BRACKET = /^(\d{1,3})?([A-Z][a-z]?|[a-z]{1,2}|\*)(@(?:TH[12]|AL[12]|SP[123]|TB\d{1,2}|OH\d{1,2}|@)?)?(H\d?)?(\+{1,3}|-{1,3}|[+-]\d{1,2})?(:\d{1,4})?$/;
const BOND = '-=#$:/\\';
const QUERY = /[~!;,&@?]/;

function fail(code: string, position: number, message: string, extra: Record<string, unknown> = {}): never {
  throw new ChemError(code, `${message} (character ${position}).`, { position, ...extra });
}

/** The characters allowed anywhere in a SMILES: printable ASCII without space. */
export function checkSmilesCharacters(s: string): void {
  const bad = firstBadSmilesCharacter(s);
  if (!bad) return;
  if (bad.codePoint === 0x20 && /^\S+ \|.*\|\s*$/.test(s)) {
    fail('cxsmiles_not_supported', bad.position, 'CXSMILES extensions (the " |…|" part) are not read: they can carry radicals, coordination bonds or attachment labels that Beadloom would drop; remove them and write what they say into the SMILES itself');
  }
  fail('unparseable_smiles', bad.position, `The SMILES contains ${bad.description}; a SMILES is printable ASCII without spaces`, { codePoint: bad.codePoint });
}

export interface SmilesText {
  /** 1-based positions of the attachment points (`*`) in the string, in order. */
  attachments: number[];
  aromatic: boolean;
}

type Prev = 'start' | 'atom' | 'ring' | 'bond' | 'open' | 'close' | 'dot';

/** Checks the whole string; returns what parse.ts needs to know about it. */
export function checkSmilesText(s: string): SmilesText {
  checkSmilesCharacters(s);
  const attachments: number[] = [];
  let aromatic = false;
  let prev: Prev = 'start';
  let beforeBond: Prev = 'start';
  let bondAt = 0;
  const branches: number[] = [];
  const rings = new Map<string, { atom: number; pos: number }>();
  let atomNo = 0;
  let i = 0;
  while (i < s.length) {
    const pos = i + 1;
    const ch = s[i];
    if (ch === '[') {
      const end = s.indexOf(']', i);
      if (end < 0) fail('incomplete_smiles', pos, 'A bracket atom "[" is never closed with "]"');
      const inner = s.slice(i + 1, end);
      const m = BRACKET.exec(inner);
      if (!m || /^\d*[RXDAarxvh]\d*$/.test(inner)) {
        if (/[~!;,&#$]|^\d*[RXDvxr]\d*$|\$\(/.test(inner)) fail('query_not_supported', pos, `"[${inner}]" is a query (SMARTS) atom, not an atom of a molecule; only "*" is read, as an attachment point`);
        fail('unparseable_smiles', pos, `"[${inner}]" is not an atom: write [isotope? element chirality? H-count? charge? :class?]`);
      }
      const symbol = m[2];
      if (symbol === '*' && (m[4] || m[5])) fail('unparseable_smiles', pos, `"[${inner}]": an attachment point carries no hydrogens and no charge; put them on its neighbour`);
      if (symbol === 'Rf') fail('unsupported_atom', pos, 'Rutherfordium has no standard atomic weight, so Beadloom cannot weigh it');
      if (symbol === '*') attachments.push(pos);
      else if (/^[a-z]/.test(symbol)) {
        if (!AROMATIC_IN_BRACKETS.has(symbol)) fail('unparseable_smiles', pos, `"${symbol}" in "[${inner}]" is not an element or an aromatic atom`);
        aromatic = true;
      } else if (!ELEMENTS.has(symbol)) fail('unparseable_smiles', pos, `"${symbol}" in "[${inner}]" is not an element symbol`);
      atomNo++;
      prev = 'atom';
      i = end + 1;
      continue;
    }
    const organic = ORGANIC.exec(s.slice(i));
    if (organic) {
      if (organic[1] === '*') attachments.push(pos);
      else if (/^[a-z]/.test(organic[1])) aromatic = true;
      atomNo++;
      prev = 'atom';
      i += organic[1].length;
      continue;
    }
    if (BOND.includes(ch)) {
      if (!['atom', 'ring', 'open', 'close'].includes(prev)) fail('unparseable_smiles', pos, `The bond "${ch}" has no atom before it`);
      beforeBond = prev;
      bondAt = pos;
      prev = 'bond';
      i++;
      continue;
    }
    if (/[0-9%]/.test(ch)) {
      let label = ch;
      if (ch === '%') {
        const m = /^%(\d\d|\(\d{1,5}\))/.exec(s.slice(i));
        if (!m) fail('unparseable_smiles', pos, 'A "%" ring bond needs two digits (or digits in parentheses) after it');
        label = String(Number(m[1].replace(/[()]/g, '')));
        i += m[0].length;
      } else i++;
      // RDKit also accepts a ring bond after a branch (`C(C)1CC1`), and so does openchemlib.
      const ok = prev === 'atom' || prev === 'ring' || prev === 'close' || (prev === 'bond' && ['atom', 'ring', 'close'].includes(beforeBond));
      if (!ok) fail('unparseable_smiles', pos, `The ring bond "${label}" does not follow an atom`);
      const open = rings.get(label);
      if (open === undefined) rings.set(label, { atom: atomNo, pos });
      else {
        if (open.atom === atomNo) fail('unparseable_smiles', pos, `The ring bond "${label}" would join an atom to itself`);
        rings.delete(label);
      }
      prev = 'ring';
      continue;
    }
    if (ch === '(') {
      if (!['atom', 'ring', 'close'].includes(prev)) fail('unparseable_smiles', pos, 'A branch "(" does not follow an atom');
      branches.push(pos);
      prev = 'open';
      i++;
      continue;
    }
    if (ch === ')') {
      if (branches.length === 0) fail('unparseable_smiles', pos, 'A branch is closed with ")" that was never opened');
      if (!['atom', 'ring', 'close'].includes(prev)) fail('unparseable_smiles', pos, 'A branch is empty or ends with a bond');
      branches.pop();
      prev = 'close';
      i++;
      continue;
    }
    if (ch === '.') {
      if (!['atom', 'ring', 'close'].includes(prev) || branches.length) fail('unparseable_smiles', pos, 'A "." must separate two complete parts');
      prev = 'dot';
      i++;
      continue;
    }
    if (QUERY.test(ch)) fail('query_not_supported', pos, `"${ch}" is a query (SMARTS) feature, not part of a molecule's SMILES`);
    fail('unparseable_smiles', pos, `"${ch}" is not part of SMILES`);
  }
  if (prev === 'bond') fail('incomplete_smiles', bondAt, 'The SMILES ends with a bond that has no atom after it');
  if (branches.length) fail('incomplete_smiles', branches[branches.length - 1], 'The branch opened here is never closed with ")"');
  for (const [label, open] of rings) fail('incomplete_smiles', open.pos, `The ring bond "${label}" opened here is never closed`);
  if (prev !== 'atom' && prev !== 'ring' && prev !== 'close') fail('incomplete_smiles', s.length, 'The SMILES ends without an atom');
  return { attachments, aromatic };
}
