import type { Molecule } from '../../src/shared/chem';
import { logPWarningOf } from '../chem/charged-groups';
import type { CoordinatesState, MoleculeDetail, MoleculeSketch, MoleculeSummary } from '../../src/shared/molecules';
import { isAttachmentAtom } from '../../src/shared/drawing/layout';

// Database rows of `molecules` → the API's MoleculeSummary / MoleculeDetail.

export interface MoleculeRow {
  id: number;
  project_id: number;
  name: string;
  smiles: string;
  notes: string;
  source: 'smiles' | 'molfile';
  canonical_smiles: string;
  formula: string;
  molecular_weight: number;
  log_p: number;
  heavy_atoms: number;
  net_charge: number;
  model: string | null;
  xyz: string | null;
  xyz_source: 'upload' | 'conformer' | null;
  conformer_status: CoordinatesState['status'];
  conformer_error: string | null;
  tags: string;
  archived: number | boolean;
  created_at: Date;
  updated_at: Date;
  mapping_count?: number;
}

export const SUMMARY_COLUMNS = [
  'id', 'project_id', 'name', 'smiles', 'notes', 'source', 'canonical_smiles', 'formula', 'molecular_weight', 'log_p',
  'heavy_atoms', 'net_charge', 'model', 'xyz_source', 'conformer_status', 'conformer_error', 'tags', 'archived',
  'created_at', 'updated_at',
].map((c) => `m.${c}`);

export function parseModel(row: Pick<MoleculeRow, 'model' | 'id'>): Molecule {
  if (!row.model) throw new Error(`molecule ${row.id} has no stored model`);
  return JSON.parse(row.model) as Molecule;
}


const round = (v: number) => Math.round(v * 100) / 100;

export function sketchOf(model: Molecule): MoleculeSketch {
  return {
    atoms: model.atoms.map((a) => [a.element, round(a.x), round(a.y), a.charge, a.hydrogens, a.isotope ?? 0, isAttachmentAtom(a) ? 1 : 0]),
    bonds: model.bonds.map((b) => [b.a, b.b, b.order, b.aromatic ? 1 : 0]),
  };
}

export function toSummary(row: MoleculeRow, queuePosition: number | null, model = parseModel(row)): MoleculeSummary {
  return {
    id: row.id,
    projectId: row.project_id,
    name: row.name,
    smiles: row.smiles,
    canonicalSmiles: row.canonical_smiles,
    formula: row.formula,
    molecularWeight: row.molecular_weight,
    logP: row.log_p,
    logPWarning: logPWarningOf(model),
    heavyAtoms: row.heavy_atoms,
    netCharge: row.net_charge,
    notes: row.notes,
    tags: JSON.parse(row.tags) as string[],
    archived: !!row.archived,
    source: row.source,
    coordinates: { source: row.xyz_source, status: row.conformer_status, queuePosition, error: row.conformer_error },
    mappingCount: Number(row.mapping_count ?? 0),
    sketch: sketchOf(model),
    createdAt: new Date(row.created_at).toISOString(),
    updatedAt: new Date(row.updated_at).toISOString(),
  };
}

export function toDetail(row: MoleculeRow, queuePosition: number | null): MoleculeDetail {
  const model = parseModel(row);
  return { ...toSummary(row, queuePosition, model), model, xyz: row.xyz ? (JSON.parse(row.xyz) as number[][]) : null };
}
