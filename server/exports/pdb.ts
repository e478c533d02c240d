import type { Vec3 } from '../../src/shared/chem';
import type { ExportSource } from './export-source';
import { FILE_TITLES, IONIC, headerLines } from './csv';

// The CG structure in the wwPDB format (Atomic Coordinate Entry Format v3.3): a CRYST1 record with a
// cubic box (the structure's extent plus 40 Å, P 1), then one HETATM pseudo-atom per bead at its
// centre (chain A; the molecule is residue 1 named CGM or the `residue` the export asks for, each free
// ion of a salt its own residue named after its bead; the element columns 77–78 are left blank on
// purpose: a bead is not an element, and readers that need one should take the bead name), CONECT records for bead–bead bonds (both
// directions, at most four partners a record), REMARK 1 lines saying what the file is and naming the
// mapping, version and the full SHA-256 (64 hex digits do not fit one 80-column line with their label,
// so they are split over two lines "sha256 (1/2): <first 32>" and "sha256 (2/2): <last 32>"; join the
// two halves to check it), REMARK 2 lines giving each serial's full bead name (the atom-name field holds four
// characters) and REMARK 3 lines giving each bead's charge and partition value (ΔG_OW in kJ/mol with
// where it comes from, or "n/a (ionic)" for a charged bead). Columns follow the format's fixed
// positions; every line is at most 80 characters.
// Centres are the evaluation's 3D centres in Å; without 3D coordinates the file falls back to the
// drawing's 2D layout (z = 0), and REMARK 1 says so.

const pad = (v: string | number, n: number) => String(v).padStart(n).slice(-n);
const left = (v: string, n: number) => v.padEnd(n).slice(0, n);
/** The drawing's bonds are 1 unit long; the 2D fallback scales them to a typical C–C bond. */
const BOND_ANGSTROM = 1.5;
const coord = (v: number) => pad(v.toFixed(3), 8);

function centres(s: ExportSource): { points: Map<string, Vec3>; threeD: boolean } {
  const points = new Map<string, Vec3>();
  const evals = new Map(s.evaluation?.beads.map((b) => [b.id, b.centre]) ?? []);
  const threeD = s.draft.beads.every((b) => !!evals.get(b.id));
  for (const b of s.draft.beads) {
    if (threeD) points.set(b.id, evals.get(b.id)!);
    else {
      const total = b.atoms.reduce((t, a) => t + a.weight, 0) || 1;
      const x = (BOND_ANGSTROM * b.atoms.reduce((t, a) => t + a.weight * s.model.atoms[a.index].x, 0)) / total;
      const y = (BOND_ANGSTROM * b.atoms.reduce((t, a) => t + a.weight * s.model.atoms[a.index].y, 0)) / total;
      points.set(b.id, [x, y, 0]);
    }
  }
  return { points, threeD };
}

export interface PdbOptions {
  /** Residue name of the molecule (1–3 letters or digits); CGM when not given. */
  residue?: string;
}

export function toPdb(s: ExportSource, options: PdbOptions = {}): string {
  const { points, threeD } = centres(s);
  const lines: string[] = [];
  const all = [...points.values()];
  const extent = Math.max(...[0, 1, 2].map((d) => Math.max(...all.map((p) => p[d])) - Math.min(...all.map((p) => p[d]))), 0);
  const edge = Math.ceil(extent + 40);
  const ionAtoms = new Set((s.model.components ?? []).filter((c) => c.freeIon).flatMap((c) => c.atoms));
  const isIon = (b: (typeof s.draft.beads)[number]) => b.atoms.length > 0 && b.atoms.every((a) => ionAtoms.has(a.index));
  let nextResidue = 2;
  const residueOf = new Map(s.draft.beads.map((b) => [b.id, isIon(b) ? { name: b.name.replace(/[^A-Za-z0-9]/g, '').slice(0, 3).toUpperCase() || 'ION', number: nextResidue++ } : { name: options.residue ?? s.draft.residue ?? 'CGM', number: 1 }]));
  const remark = (n: number, text: string) => lines.push(`REMARK ${pad(n, 3)} ${text}`.slice(0, 80));
  for (const l of headerLines(s, FILE_TITLES.pdb)) {
    if (l.startsWith('sha256: ')) {
      remark(1, `sha256 (1/2): ${s.sha256.slice(0, 32)}`);
      remark(1, `sha256 (2/2): ${s.sha256.slice(32)}`);
    } else remark(1, l.replace(/[\r\n]+/g, ' '));
  }
  remark(1, `residue: ${options.residue ?? s.draft.residue ?? 'CGM'} for the molecule; element columns blank (beads are not elements)`);
  remark(1, threeD ? 'centres: bead centres from 3D coordinates, angstrom' : 'centres: no 3D coordinates yet; 2D drawing layout at 1.5 A per bond, z = 0');
  const serial = new Map<string, number>();
  s.draft.beads.forEach((b, i) => {
    serial.set(b.id, i + 1);
    remark(2, `bead ${pad(i + 1, 5)} ${b.name}`);
  });
  const evaluated = new Map(s.evaluation?.beads.map((b) => [b.id, b]) ?? []);
  s.draft.beads.forEach((b, i) => {
    const e = evaluated.get(b.id);
    if (!e) return;
    const dG = e.partitionSource === 'ionic' || (e.ionic && e.partitionSource !== 'measured') ? IONIC : typeof e.partitionDeltaG === 'number' ? `${e.partitionDeltaG.toFixed(2)} kJ/mol (${e.partitionSource})` : typeof e.deltaG === 'number' ? `${e.deltaG.toFixed(2)} kJ/mol (atoms)` : 'none';
    remark(3, `bead ${pad(i + 1, 5)} charge ${e.charge.toFixed(2)} dG_OW ${dG}`);
  });
  lines.push(`CRYST1${pad(edge.toFixed(3), 9)}${pad(edge.toFixed(3), 9)}${pad(edge.toFixed(3), 9)}${pad('90.00', 7)}${pad('90.00', 7)}${pad('90.00', 7)} ${left('P 1', 11)}${pad(1, 4)}`);
  s.draft.beads.forEach((b, i) => {
    const [x, y, z] = points.get(b.id)!;
    const name = b.name.replace(/\s+/g, '').slice(0, 4);
    const r = residueOf.get(b.id)!;
    lines.push(`HETATM${pad(i + 1, 5)} ${left(name, 4)} ${pad(r.name, 3)} A${pad(r.number, 4)}    ${coord(x)}${coord(y)}${coord(z)}${pad('1.00', 6)}${pad('0.00', 6)}`);
  });
  const partners = new Map<number, number[]>();
  for (const [a, b] of s.evaluation?.topology.bonds ?? []) {
    const i = serial.get(a);
    const j = serial.get(b);
    if (!i || !j) continue;
    partners.set(i, [...(partners.get(i) ?? []), j]);
    partners.set(j, [...(partners.get(j) ?? []), i]);
  }
  for (const i of [...partners.keys()].sort((x, y) => x - y)) {
    const all = partners.get(i)!.sort((x, y) => x - y);
    for (let k = 0; k < all.length; k += 4) lines.push(`CONECT${pad(i, 5)}${all.slice(k, k + 4).map((j) => pad(j, 5)).join('')}`);
  }
  lines.push('END');
  return lines.map((l) => l.trimEnd()).join('\n') + '\n';
}
