import type { CgModel, CgMoleculeType } from './cg-model';
import type { NonbondedType } from './nonbonded';
import { placeholderNote } from './nonbonded';

// GROMACS files of a CG model (GROMACS 2022 reference manual, "Topology file" and "File formats"):
// one .itp per molecule type, topol.top with [ defaults ] and [ atomtypes ], conf.gro of the bead
// centres in a box, and md.mdp for a short stability run. Function numbers per term: bonds 1
// (harmonic), constraints 1, angles 1 (harmonic) or 2 (cosine-harmonic), dihedrals 1 (periodic) and
// 2 (improper harmonic); see src/shared/bonded-terms.ts for the energy forms.

export interface TextFile {
  name: string;
  text: string;
}

/** A number as GROMACS reads it, without exponent and without trailing noise (charges keep 9 decimals). */
export const num = (v: number, digits = 6) => {
  const s = v.toFixed(digits).replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '.0');
  return s === '-0.0' ? '0.0' : s;
};

const comment = (lines: readonly string[]) => lines.map((l) => `; ${l.replace(/[\r\n]+/g, ' ')}`);
/** A GROMACS atom name (five characters in .gro). */
export const atomName = (name: string, i: number) => name.replace(/\s+/g, '').slice(0, 5) || `B${i + 1}`;

export function itp(t: CgMoleculeType, typeName: (beadType: string) => string, header: readonly string[]): string {
  const out = [...comment(header), '', '[ moleculetype ]', '; name  nrexcl', `${t.name}  ${t.nrexcl}`, '', '[ atoms ]', '; nr  type  resnr  residue  atom  cgnr  charge  mass  ; bead name'];
  t.beads.forEach((b, i) => out.push(`${i + 1}  ${typeName(b.type)}  ${b.residue}  ${t.residue}  ${atomName(b.name, i)}  ${i + 1}  ${num(b.charge, 9)}  ${num(b.mass, 4)}  ; ${b.name}`));
  const section = (title: string, columns: string, rows: string[]) => {
    if (rows.length > 0) out.push('', `[ ${title} ]`, `; ${columns}`, ...rows);
  };
  const ids = (beads: number[]) => beads.map((i) => i + 1).join('  ');
  const terms = t.terms;
  section('bonds', 'i  j  funct  b0 (nm)  kb (kJ mol-1 nm-2)', terms.filter((x) => x.kind === 'bond' && !x.params.constraint).map((x) => `${ids(x.beads)}  1  ${num(x.params.value!)}  ${num(x.params.k!)}`));
  section('constraints', 'i  j  funct  b0 (nm)', terms.filter((x) => x.kind === 'bond' && x.params.constraint).map((x) => `${ids(x.beads)}  1  ${num(x.params.value!)}`));
  section('angles', 'i  j  k  funct  theta0 (deg)  k (kJ mol-1 rad-2, or kJ mol-1 for funct 2)', terms.filter((x) => x.kind === 'angle').map((x) => `${ids(x.beads)}  ${x.params.function === 'cosine-harmonic' ? 2 : 1}  ${num(x.params.value!)}  ${num(x.params.k!)}`));
  section(
    'dihedrals',
    'i  j  k  l  funct  phase or xi0 (deg)  k (kJ mol-1, or kJ mol-1 rad-2 for funct 2)  multiplicity',
    terms.filter((x) => x.kind === 'dihedral' || x.kind === 'improper').map((x) => (x.kind === 'dihedral' ? `${ids(x.beads)}  1  ${num(x.params.value!)}  ${num(x.params.k!)}  ${x.params.multiplicity}` : `${ids(x.beads)}  2  ${num(x.params.value!)}  ${num(x.params.k!)}`)),
  );
  section('exclusions', 'pairs of a rigid ring (all its bonds constraints) excluded beyond nrexcl', t.exclusions.map(([a, b]) => `${a + 1}  ${b + 1}`));
  return out.join('\n') + '\n';
}

export function topol(model: CgModel, types: readonly NonbondedType[], itpNames: readonly string[], systemName: string, header: readonly string[]): string {
  const out = [...comment(header), ...comment(placeholderNote(types)), '', '[ defaults ]', '; nbfunc  comb-rule  gen-pairs', '1  2  no', '', '[ atomtypes ]', '; name  mass  charge  ptype  sigma (nm)  epsilon (kJ mol-1)'];
  for (const t of types) out.push(`${t.engineName}  0.0  0.0  A  ${num(t.sigma)}  ${num(t.epsilon)}${t.placeholder ? '  ; PLACEHOLDER, not a force-field value' : ''}${t.engineName !== t.beadType ? `  ; bead type "${t.beadType.replace(/[\r\n]+/g, ' ')}"` : ''}`);
  out.push('');
  for (const n of itpNames) out.push(`#include "${n}"`);
  out.push('', '[ system ]', systemName.replace(/[\r\n]+/g, ' ') || 'Beadloom CG model', '', '[ molecules ]', '; name  count');
  for (const t of model.types) out.push(`${t.name}  1`);
  return out.join('\n') + '\n';
}

/** Box edge (nm): the structure's largest extent plus room for the 1.2 nm cut-off on both sides. */
export function boxEdge(model: CgModel): number {
  const all = model.types.flatMap((t) => t.beads.map((b) => b.xyz));
  let edge = 0;
  for (let d = 0; d < 3; d++) edge = Math.max(edge, Math.max(...all.map((p) => p[d])) - Math.min(...all.map((p) => p[d])));
  return Math.ceil((edge + 4) * 10) / 10;
}

/** The structure moved so its bounding box sits in the middle of a cubic box of `edge` nm. */
export function centred(model: CgModel, edge: number): CgModel {
  const all = model.types.flatMap((t) => t.beads.map((b) => b.xyz));
  const shift = [0, 1, 2].map((d) => edge / 2 - (Math.max(...all.map((p) => p[d])) + Math.min(...all.map((p) => p[d]))) / 2);
  return { types: model.types.map((t) => ({ ...t, beads: t.beads.map((b) => ({ ...b, xyz: [b.xyz[0] + shift[0], b.xyz[1] + shift[1], b.xyz[2] + shift[2]] })) })) };
}

export function gro(model: CgModel, edge: number, title: string): string {
  const lines = [title.replace(/[\r\n]+/g, ' ').slice(0, 200), String(model.types.reduce((n, t) => n + t.beads.length, 0)).padStart(5)];
  let serial = 0;
  let residues = 0;
  model.types.forEach((t) => {
    const first = residues;
    t.beads.forEach((b, i) => {
      serial++;
      residues = Math.max(residues, first + b.residue);
      const f = (v: number) => v.toFixed(3).padStart(8);
      lines.push(`${String((first + b.residue) % 100000).padStart(5)}${t.residue.padEnd(5).slice(0, 5)}${atomName(b.name, i).padStart(5)}${String(serial % 100000).padStart(5)}${f(b.xyz[0])}${f(b.xyz[1])}${f(b.xyz[2])}`);
    });
  });
  lines.push(`${edge.toFixed(5).padStart(10)}${edge.toFixed(5).padStart(10)}${edge.toFixed(5).padStart(10)}`);
  return lines.join('\n') + '\n';
}

/** A short stability run: 10,000 steps of 2 fs with a stochastic-free thermostat; a test, not production settings. */
export function mdp(header: readonly string[]): string {
  return [
    ...comment(header),
    '; A short stability run of the exported model (10,000 steps); settings are generic, not a force field\'s.',
    'integrator               = md',
    'dt                       = 0.002',
    'nsteps                   = 10000',
    'nstxout-compressed       = 100',
    'nstenergy                = 100',
    'cutoff-scheme            = Verlet',
    'nstlist                  = 20',
    'pbc                      = xyz',
    'coulombtype              = reaction-field',
    'rcoulomb                 = 1.2',
    'epsilon-r                = 1',
    'vdwtype                  = cut-off',
    'rvdw                     = 1.2',
    'tcoupl                   = v-rescale',
    'tc-grps                  = System',
    'tau-t                    = 1.0',
    'ref-t                    = 300',
    'pcoupl                   = no',
    'gen-vel                  = yes',
    'gen-temp                 = 300',
    'gen-seed                 = 1',
    'constraints              = none',
    'constraint-algorithm     = lincs',
    '',
  ].join('\n');
}
