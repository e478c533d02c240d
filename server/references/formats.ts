// Reference file formats, told apart by the file name's extension (as the engines themselves do).

export const STRUCTURE_FORMATS = ['gro', 'pdb', 'mol'] as const;
export const TRAJECTORY_FORMATS = ['xtc', 'trr', 'dcd', 'pdb', 'gro', 'xyz'] as const;
export type StructureFormat = (typeof STRUCTURE_FORMATS)[number];
export type TrajectoryFormat = (typeof TRAJECTORY_FORMATS)[number];

export function structureFormatOf(fileName: string): StructureFormat | null {
  const ext = extension(fileName);
  if (ext === 'gro' || ext === 'pdb') return ext;
  if (ext === 'ent') return 'pdb';
  if (ext === 'mol' || ext === 'sdf' || ext === 'mdl') return 'mol';
  return null;
}

export function trajectoryFormatOf(fileName: string): TrajectoryFormat | null {
  const ext = extension(fileName);
  return (TRAJECTORY_FORMATS as readonly string[]).includes(ext) ? (ext as TrajectoryFormat) : null;
}

function extension(fileName: string): string {
  const dot = fileName.lastIndexOf('.');
  return dot < 0 ? '' : fileName.slice(dot + 1).toLowerCase();
}
