import * as Y from 'yjs';
import { createHash } from 'node:crypto';
import type { Db } from '../db/knex';
import type { Mapping } from '../../src/shared/chem';
import { contentText, contentToMapping, type ContentBead, type ImportBody, type ImportCorrespondence, type ImportPreview } from '../../src/shared/exports';
import { mappingToDoc } from '../../src/shared/mapping-doc';
import { checkDoc } from '../../src/shared/mapping-doc-check';
import { unprocessable } from '../http/errors';
import { createMapping } from '../mappings/mappings.service';
import { appendAudit } from '../audit/audit.service';
import { parseModel } from '../molecules/molecule-view';
import { correspond } from './import-correspondence';

// Import of a JSON export as a new mapping of a molecule. The beads are placed by structure: the
// file's atoms and bonds are matched to the molecule's (import-correspondence.ts), so a file
// exported from a molecule drawn in another atom order lands on the same chemical atoms.
// Refused (422, nothing written) when the file's molecule is another one (canonical SMILES differ,
// or no correspondence of atoms and bonds), when an atom number is outside the file's molecule, or
// when the beads do not form a valid draft. Content that no longer matches its SHA-256 (edited by
// hand) is refused with `content_hash_mismatch` unless `allowModified`; the import is then recorded
// in the audit trail as made from an edited file.

export interface PlannedImport {
  name: string;
  resolution: ImportBody['mapping']['resolution'];
  modified: boolean;
  correspondence: ImportCorrespondence;
  beads: ContentBead[];
  draft: Mapping;
}

export async function planImport(db: Db, moleculeId: number, body: ImportBody): Promise<PlannedImport> {
  const row = await db('molecules').where({ id: moleculeId }).first('id', 'canonical_smiles', 'name', 'model');
  const expected = row.canonical_smiles as string;
  if (body.content.canonicalSmiles !== expected) {
    throw unprocessable('molecule_mismatch', `The file maps ${body.content.canonicalSmiles}, but ${row.name} is ${expected}; import it into a molecule with the same structure.`, {
      expected,
      got: body.content.canonicalSmiles,
    });
  }
  const sha = createHash('sha256').update(contentText(body.content), 'utf8').digest('hex');
  const modified = sha !== body.sha256;

  const ids = new Set<string>();
  for (const b of body.content.beads) {
    if (ids.has(b.id)) throw unprocessable('import_invalid', `Two beads share the id ${b.id}.`, { bead: b.id });
    ids.add(b.id);
    if (new Set(b.atoms.map(([n]) => n)).size !== b.atoms.length) throw unprocessable('import_invalid', `Bead ${b.name} lists an atom twice.`, { bead: b.name });
  }
  const model = parseModel({ id: row.id, model: row.model });
  const fileAtoms = body.molecule?.atoms.length ?? model.atoms.length;
  for (const b of body.content.beads) {
    const bad = b.atoms.find(([n]) => n > fileAtoms);
    if (bad) throw unprocessable('atom_out_of_range', `Bead ${b.name} names atom ${bad[0]}, but the file's molecule has atoms 1 to ${fileAtoms}.`, { bead: b.name, atom: bad[0], atomCount: fileAtoms });
  }

  const correspondence = correspond(body, model, row.name as string);
  const beads: ContentBead[] = body.content.beads.map((b) => ({
    ...b,
    atoms: b.atoms.map(([n, w]): [number, number] => [correspondence.atoms[n - 1], w]).sort((p, q) => p[0] - q[0]),
  }));
  const draft: Mapping = contentToMapping({ canonicalSmiles: body.content.canonicalSmiles, beads, ...(body.content.partitionBasis ? { partitionBasis: body.content.partitionBasis } : {}) });
  const doc = new Y.Doc();
  mappingToDoc(doc, draft);
  const problem = checkDoc(doc, model.atoms.length);
  if (problem) throw unprocessable('import_invalid', `The beads do not form a valid draft: ${problem.message}`, problem);
  return { name: body.name ?? `${body.mapping.name} (imported)`, resolution: body.mapping.resolution, modified, correspondence, beads, draft };
}

export function previewOf(plan: PlannedImport): ImportPreview {
  return { preview: true, mapping: { name: plan.name, resolution: plan.resolution }, modified: plan.modified, correspondence: plan.correspondence, beads: plan.beads };
}

export async function importMapping(db: Db, moleculeId: number, body: ImportBody, userId: number): Promise<{ id: number; plan: PlannedImport }> {
  const plan = await planImport(db, moleculeId, body);
  if (plan.modified && !body.allowModified) {
    throw unprocessable('content_hash_mismatch', 'The file’s content does not match its sha256: it was edited or damaged after export. Check it (preview), then import it with allowModified to accept the edits.', {
      expected: body.sha256,
      got: createHash('sha256').update(contentText(body.content), 'utf8').digest('hex'),
      allowModified: false,
    });
  }
  const source = `${body.mapping.name} (sha256 ${body.sha256.slice(0, 12)}…)`;
  const edited = plan.modified ? ' The file had been edited after export: its content no longer matches that sha256.' : '';
  const placed = plan.correspondence.renumbered ? ` ${plan.correspondence.renumbered} atom number(s) differ from the file's, matched by structure.` : '';
  const id = await db.transaction(async (trx) => {
    const id = await createMapping(trx as unknown as Db, moleculeId, { name: plan.name, resolution: plan.resolution, description: `Imported from a Beadloom export of ${source}.${edited}` }, userId, plan.draft);
    await appendAudit(trx, { mappingId: id, action: 'import', actorId: userId, version: null, reason: `Imported from ${source}.${placed}${edited}${plan.correspondence.choice ? ` ${plan.correspondence.choice}` : ''}` });
    return id;
  });
  return { id, plan };
}
