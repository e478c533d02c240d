import type { CgModel, CgTerm } from './cg-model';
import type { NonbondedType } from './nonbonded';
import { placeholderNote } from './nonbonded';
import { unprocessable } from '../http/errors';

// LAMMPS files of a CG model (LAMMPS 29 Sep 2021 manual: read_data, atom_style full, units real):
// a data file and an input script for a short run. Conversions from the GROMACS units the table holds:
//   - 1 kcal = 4.184 kJ exactly: the thermochemical calorie, a defined unit (NIST SP 811, 2008,
//     appendix B.8; ISO 80000-5), so kJ mol⁻¹ → kcal mol⁻¹ divides by 4.184;
//   - 1 nm = 10 Å, so nm⁻² → Å⁻² divides by 100 and lengths multiply by 10;
//   - the ½ of GROMACS' harmonic forms (E = ½k(x − x0)²) is inside LAMMPS' K (E = K(x − x0)²):
//     K = k/2 for harmonic bonds, angles, cosine-squared angles and harmonic impropers; a periodic
//     dihedral has no ½ in either (E = K[1 + cos(nφ − d)]), K = k.
// A constraint becomes a harmonic bond in LAMMPS (its SHAKE cannot hold rings of constraints): with
// the row's k when given, else the stiff stand-in below, said in the data file's header.

export const KJ_PER_KCAL = 4.184;
export const ANGSTROM_PER_NM = 10;
/** Force constant for a constraint without k, kJ mol⁻¹ nm⁻² (a numerical stand-in, no source). */
export const CONSTRAINT_STAND_IN_K = 50_000;

/** kJ mol⁻¹ nm⁻² (GROMACS, ½k form) → kcal mol⁻¹ Å⁻² (LAMMPS bond K, no ½). */
export const bondK = (kGromacs: number) => kGromacs / 2 / KJ_PER_KCAL / (ANGSTROM_PER_NM * ANGSTROM_PER_NM);
/** kJ mol⁻¹ rad⁻² (½k form) → kcal mol⁻¹ rad⁻² (K form); also cosine-squared angles and impropers. */
export const angleK = (kGromacs: number) => kGromacs / 2 / KJ_PER_KCAL;
export const kcal = (kj: number) => kj / KJ_PER_KCAL;

const n6 = (v: number) => Number(v.toFixed(6)).toString();

interface Written {
  data: string;
  input: string;
}

export function lammpsFiles(model: CgModel, types: readonly NonbondedType[], header: readonly string[], dataName: string): Written {
  // LAMMPS masses belong to atom types: one type per (bead type, mass).
  const atomTypes: { nb: NonbondedType; mass: number }[] = [];
  const typeOf = (beadType: string, mass: number) => {
    const nb = types.find((t) => t.beadType === beadType)!;
    let i = atomTypes.findIndex((a) => a.nb === nb && Math.abs(a.mass - mass) < 1e-9);
    if (i < 0) i = atomTypes.push({ nb, mass }) - 1;
    return i + 1;
  };
  const atoms: string[] = [];
  const bonds: string[] = [];
  const angles: string[] = [];
  const dihedrals: string[] = [];
  const impropers: string[] = [];
  const bondCoeffs: string[] = [];
  const angleCoeffs: string[] = [];
  const dihedralCoeffs: string[] = [];
  const improperCoeffs: string[] = [];
  const angleStyles = new Set<string>();
  const stiff: string[] = [];
  const exclusionBonds: string[] = [];
  let offset = 0;
  const bad: string[] = [];
  model.types.forEach((t, m) => {
    t.beads.forEach((b, i) => atoms.push(`${offset + i + 1} ${m + 1} ${typeOf(b.type, b.mass)} ${n6(b.charge)} ${n6(b.xyz[0] * ANGSTROM_PER_NM)} ${n6(b.xyz[1] * ANGSTROM_PER_NM)} ${n6(b.xyz[2] * ANGSTROM_PER_NM)}  # ${b.name.replace(/[\r\n]+/g, ' ')}`));
    const ids = (x: CgTerm) => x.beads.map((i) => i + offset + 1).join(' ');
    for (const x of t.terms) {
      const p = x.params;
      if (x.kind === 'bond') {
        const k = p.k ?? CONSTRAINT_STAND_IN_K;
        if (p.constraint && p.k === null) stiff.push(ids(x));
        bondCoeffs.push(`${bondCoeffs.length + 1} ${n6(bondK(k))} ${n6(p.value! * ANGSTROM_PER_NM)}`);
        bonds.push(`${bonds.length + 1} ${bondCoeffs.length} ${ids(x)}`);
      } else if (x.kind === 'angle') {
        const style = p.function === 'cosine-harmonic' ? 'cosine/squared' : 'harmonic';
        angleStyles.add(style);
        angleCoeffs.push(`${angleCoeffs.length + 1} ${style} ${n6(angleK(p.k!))} ${n6(p.value!)}`);
        angles.push(`${angles.length + 1} ${angleCoeffs.length} ${ids(x)}`);
      } else if (x.kind === 'dihedral') {
        // dihedral_style charmm takes the phase d as a whole number of degrees.
        if (!Number.isInteger(p.value!)) bad.push(`dihedral ${x.beads.map((i) => t.beads[i].name).join('–')}: LAMMPS' periodic (charmm) dihedral takes a whole-degree phase; got ${p.value}.`);
        dihedralCoeffs.push(`${dihedralCoeffs.length + 1} ${n6(kcal(p.k!))} ${p.multiplicity} ${Math.round(p.value!)} 0.0`);
        dihedrals.push(`${dihedrals.length + 1} ${dihedralCoeffs.length} ${ids(x)}`);
      } else {
        improperCoeffs.push(`${improperCoeffs.length + 1} ${n6(angleK(p.k!))} ${n6(p.value!)}`);
        impropers.push(`${impropers.length + 1} ${improperCoeffs.length} ${ids(x)}`);
      }
    }
    // GROMACS' [ exclusions ] of a rigid ring, the LAMMPS way: a pair of the ring that no bond joins
    // gets a bond of zero force constant, so special_bonds treats it as a 1-2 pair (weight 0 when
    // nrexcl ≥ 1) and it adds no energy. r0 is the pair's starting distance (unused while K = 0).
    const joined = new Set(t.terms.filter((x) => x.kind === 'bond').map((x) => [...x.beads].sort((a, b) => a - b).join(',')));
    for (const [a, b] of t.exclusions) {
      if (joined.has(`${a},${b}`)) continue;
      const [p, q] = [t.beads[a].xyz, t.beads[b].xyz];
      const r0 = Math.hypot(p[0] - q[0], p[1] - q[1], p[2] - q[2]) * ANGSTROM_PER_NM;
      bondCoeffs.push(`${bondCoeffs.length + 1} 0.0 ${n6(r0)}  # exclusion only: rigid-ring pair ${t.beads[a].name}-${t.beads[b].name}`.replace(/[\r\n]+/g, ' '));
      bonds.push(`${bonds.length + 1} ${bondCoeffs.length} ${a + offset + 1} ${b + offset + 1}`);
      exclusionBonds.push(`${a + offset + 1}-${b + offset + 1}`);
    }
    offset += t.beads.length;
  });
  if (bad.length > 0) throw unprocessable('model_incomplete', `This state cannot be exported to LAMMPS: ${bad.join(' ')}`, { problems: bad.map((message) => ({ check: 'lammps_dihedral_phase', message })) });
  const hybridAngles = angleStyles.size > 1;
  if (!hybridAngles) for (let i = 0; i < angleCoeffs.length; i++) angleCoeffs[i] = angleCoeffs[i].replace(/^(\d+) (harmonic|cosine\/squared) /, '$1 ');

  const all = model.types.flatMap((t) => t.beads.map((b) => b.xyz.map((v) => v * ANGSTROM_PER_NM)));
  const lo = [0, 1, 2].map((d) => Math.min(...all.map((p) => p[d])));
  const hi = [0, 1, 2].map((d) => Math.max(...all.map((p) => p[d])));
  const edge = Math.ceil(Math.max(...hi.map((h, d) => h - lo[d])) + 40);
  const mid = [0, 1, 2].map((d) => (lo[d] + hi[d]) / 2);
  const box = [0, 1, 2].map((d) => `${n6(mid[d] - edge / 2)} ${n6(mid[d] + edge / 2)} ${'xyz'[d]}lo ${'xyz'[d]}hi`);

  const data = [
    `Beadloom CG model (LAMMPS data file, atom_style full, units real) ${header[1] ?? ''}`.replace(/[\r\n]+/g, ' '),
    '',
    `${atoms.length} atoms`,
    `${bonds.length} bonds`,
    `${angles.length} angles`,
    `${dihedrals.length} dihedrals`,
    `${impropers.length} impropers`,
    '',
    `${atomTypes.length} atom types`,
    `${Math.max(bondCoeffs.length, 0)} bond types`,
    `${angleCoeffs.length} angle types`,
    `${dihedralCoeffs.length} dihedral types`,
    `${improperCoeffs.length} improper types`,
    '',
    ...box,
    '',
    'Masses',
    '',
    ...atomTypes.map((a, i) => `${i + 1} ${n6(a.mass)}  # ${a.nb.engineName}`),
    '',
    'Pair Coeffs # lj/cut/coul/cut: epsilon (kcal/mol) sigma (A)',
    '',
    ...atomTypes.map((a, i) => `${i + 1} ${n6(kcal(a.nb.epsilon))} ${n6(a.nb.sigma * ANGSTROM_PER_NM)}${a.nb.placeholder ? '  # PLACEHOLDER, not a force-field value' : ''}`),
    ...(bondCoeffs.length ? ['', 'Bond Coeffs # harmonic: K (kcal/mol/A^2, E = K(r-r0)^2) r0 (A)', '', ...bondCoeffs] : []),
    ...(angleCoeffs.length ? ['', `Angle Coeffs # ${hybridAngles ? 'hybrid' : [...angleStyles][0]}: K (kcal/mol/rad^2 or kcal/mol) theta0 (deg)`, '', ...angleCoeffs] : []),
    ...(dihedralCoeffs.length ? ['', 'Dihedral Coeffs # charmm: K (kcal/mol) n d (deg) weight', '', ...dihedralCoeffs] : []),
    ...(improperCoeffs.length ? ['', 'Improper Coeffs # harmonic: K (kcal/mol/rad^2) chi0 (deg)', '', ...improperCoeffs] : []),
    '',
    'Atoms # full: atom-ID molecule-ID atom-type q x y z',
    '',
    ...atoms,
    ...(bonds.length ? ['', 'Bonds', '', ...bonds] : []),
    ...(angles.length ? ['', 'Angles', '', ...angles] : []),
    ...(dihedrals.length ? ['', 'Dihedrals', '', ...dihedrals] : []),
    ...(impropers.length ? ['', 'Impropers', '', ...impropers] : []),
    '',
  ].join('\n');

  const nrexcl = model.types[0]?.nrexcl ?? 1;
  const special = ['1.0', '1.0', '1.0'].map((v, i) => (i < nrexcl ? '0.0' : v)).join(' ');
  const notes = [
    ...header,
    `Units real: lengths in A, energies in kcal/mol; converted from kJ/mol with 1 kcal = ${KJ_PER_KCAL} kJ exactly (thermochemical calorie, NIST SP 811 B.8).`,
    'Harmonic K here includes the 1/2 of the GROMACS forms: K = k/2 (bonds, angles, impropers); dihedral K = k.',
    ...(stiff.length ? [`Constraints ${stiff.join('; ')} are harmonic bonds with a stiff stand-in k = ${CONSTRAINT_STAND_IN_K} kJ/mol/nm^2 (no source; LAMMPS SHAKE cannot hold rings of constraints).`] : []),
    `Exclusions: special_bonds ${special} follows the exclusion count ${nrexcl} (bonded neighbours up to ${nrexcl} bonds apart).`,
    ...(exclusionBonds.length
      ? [
          `Rigid-ring pairs ${exclusionBonds.join(', ')} are joined by bonds of zero force constant so they are excluded as 1-2 pairs (GROMACS: [ exclusions ]).${nrexcl === 0 ? ' With exclusion count 0 they are NOT excluded here (1-2 weight 1.0), unlike GROMACS.' : nrexcl >= 2 ? ` With exclusion count ${nrexcl}, pairs up to ${nrexcl} bonds apart through them are excluded too, which GROMACS does not do.` : ''}`,
        ]
      : []),
    ...placeholderNote(types),
  ];
  const input = [
    ...notes.map((l) => `# ${l.replace(/[\r\n]+/g, ' ')}`),
    'units           real',
    'atom_style      full',
    'boundary        p p p',
    'pair_style      lj/cut/coul/cut 12.0',
    ...(bonds.length ? ['bond_style      harmonic'] : []),
    ...(angles.length ? [`angle_style     ${hybridAngles ? 'hybrid harmonic cosine/squared' : [...angleStyles][0]}`] : []),
    ...(dihedrals.length ? ['dihedral_style  charmm'] : []),
    ...(impropers.length ? ['improper_style  harmonic'] : []),
    `read_data       ${dataName}`,
    `special_bonds   lj/coul ${special}`,
    'neighbor        2.0 bin',
    'neigh_modify    every 1 delay 0 check yes',
    'thermo_style    custom step temp pe ke etotal ebond eangle edihed eimp evdwl ecoul',
    'thermo          1000',
    'minimize        1.0e-6 1.0e-8 1000 10000',
    'reset_timestep  0',
    'velocity        all create 300.0 4928459 dist gaussian mom yes rot yes',
    'fix             run all nvt temp 300.0 300.0 200.0',
    'timestep        2.0',
    'dump            traj all custom 100 traj.lammpstrj id mol xu yu zu',
    'dump_modify     traj sort id',
    'run             10000',
    'write_data      final.data',
    '',
  ].join('\n');
  return { data, input };
}
