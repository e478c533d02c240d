import type { ExportSource } from './export-source';
import { stateLabel } from './export-source';
import { headerLines } from './csv';
import { buildCgModel } from './cg-model';
import { boxEdge, centred, gro, itp, mdp, topol, type TextFile } from './gromacs';
import { lammpsFiles } from './lammps';
import { nonbondedTypes, placeholderNote, type LibraryNonbonded } from './nonbonded';
import { beadIndexGroups, writeNdx } from './ndx';
import { slug } from './render';
import type { AnalysisStructure } from './analysis-structure';

// The engine downloads (docs/exports.md): a zip of GROMACS or LAMMPS files for one state of a mapping.

export const ENGINE_TITLES = {
  gromacs: 'Beadloom CG model for GROMACS',
  lammps: 'Beadloom CG model for LAMMPS',
} as const;
export type EngineFormat = keyof typeof ENGINE_TITLES;

export function engineFiles(s: ExportSource, format: EngineFormat, library: LibraryNonbonded, units = 1, structure?: AnalysisStructure): TextFile[] {
  const model = buildCgModel(s, units, structure?.centres);
  const types = nonbondedTypes(model, library);
  const header = [...headerLines(s, ENGINE_TITLES[format]), ...(structure ? [`Coordinates: ${structure.note}.`] : [])];
  const base = slug(s.mappingName);
  if (format === 'lammps') {
    const dataName = `${base}.data`;
    const { data, input } = lammpsFiles(model, types, header, dataName);
    return [
      { name: dataName, text: data },
      { name: 'in.run', text: input },
    ];
  }
  const edge = boxEdge(model);
  const placed = centred(model, edge);
  const typeName = (beadType: string) => types.find((t) => t.beadType === beadType)!.engineName;
  const itps = model.types.map((t) => ({ name: `${slug(t.name)}.itp`, text: itp(t, typeName, [...header, `Molecule type ${t.name}: bead types, masses (u), exact charges (e), bonded terms in nm, degrees, kJ/mol.`, ...placeholderNote(types)]) }));
  const ndxHeader = [...header, 'Atom-to-bead index: one group per bead, atoms numbered as in the all-atom molecule (atoms, then hydrogens by parent).'];
  return [
    ...itps,
    { name: 'topol.top', text: topol(model, types, itps.map((f) => f.name), `${s.moleculeName} (${s.mappingName}, ${stateLabel(s)})`, header) },
    { name: 'conf.gro', text: gro(placed, edge, `${header[0]}; ${s.mappingName} ${stateLabel(s)}; ${structure?.note ?? 'bead centres from 3D coordinates, nm'}`) },
    { name: 'md.mdp', text: mdp(header) },
    { name: `${base}-atoms.ndx`, text: writeNdx(beadIndexGroups(s.model, s.draft.beads), ndxHeader) },
    ...(structure?.referenceNdx ? [structure.referenceNdx] : []),
  ];
}

/** The zip of an engine export, as a buffer (the files are small). */
export async function engineZip(s: ExportSource, format: EngineFormat, library: LibraryNonbonded, units = 1, structure?: AnalysisStructure): Promise<{ name: string; body: Buffer }> {
  const files = engineFiles(s, format, library, units, structure);
  const { ZipArchive } = await import('archiver');
  const zip = new ZipArchive({ zlib: { level: 6 } });
  const chunks: Buffer[] = [];
  zip.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<void>((resolve, reject) => {
    zip.on('end', resolve);
    zip.on('error', reject);
  });
  const folder = `${slug(s.mappingName)}-${stateLabel(s)}${units > 1 ? `-${units}-units` : ''}-${format}`;
  for (const f of files) zip.append(f.text, { name: `${folder}/${f.name}` });
  await zip.finalize();
  await done;
  return { name: `${folder}.zip`, body: Buffer.concat(chunks) };
}
