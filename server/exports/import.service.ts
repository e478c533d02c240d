import * as Y from 'yjs';
import type { Db } from '../db/knex';
import { contentText, contentToMapping, type ImportBody } from '../../src/shared/exports';
import { mappingToDoc } from '../../src/shared/mapping-doc';
import { checkDoc } from '../../src/shared/mapping-doc-check';
import { unprocessable } from '../http/errors';
import { createMapping } from '../mappings/mappings.service';
import { createHash } from 'node:crypto';

// Import of a JSON export as a new mapping of a molecule. Refused (422, nothing written) when the
// file's molecule is another one (canonical SMILES differ), when its content does not match its
// SHA-256 (edited or damaged), when an atom number is outside the molecule, or when the beads do not
// form a valid draft.
export async function importMapping(db: Db, moleculeId: number, body: ImportBody, userId: number): Promise<number> {
  const molecule = await db('molecules').where({ id: moleculeId }).first('canonical_smiles', 'heavy_atoms', 'name');
  const expected = molecule.canonical_smiles as string;
  if (body.content.canonicalSmiles !== expected) {
    throw unprocessable('molecule_mismatch', `The file maps ${body.content.canonicalSmiles}, but ${molecule.name} is ${expected}; import it into a molecule with the same structure.`, {
      expected,
      got: body.content.canonicalSmiles,
    });
  }
  const sha = createHash('sha256').update(contentText(body.content), 'utf8').digest('hex');
  if (sha !== body.sha256) throw unprocessable('content_hash_mismatch', 'The file’s content does not match its sha256; it was changed or damaged after export.', { expected: body.sha256, got: sha });
  const atomCount = Number(molecule.heavy_atoms);
  const ids = new Set<string>();
  for (const b of body.content.beads) {
    if (ids.has(b.id)) throw unprocessable('import_invalid', `Two beads share the id ${b.id}.`, { bead: b.id });
    ids.add(b.id);
    if (new Set(b.atoms.map(([n]) => n)).size !== b.atoms.length) throw unprocessable('import_invalid', `Bead ${b.name} lists an atom twice.`, { bead: b.name });
  }
  for (const b of body.content.beads) {
    const bad = b.atoms.find(([n]) => n > atomCount);
    if (bad) throw unprocessable('atom_out_of_range', `Bead ${b.name} names atom ${bad[0]}, but the molecule has atoms 1 to ${atomCount}.`, { bead: b.name, atom: bad[0], atomCount });
  }
  const draft = contentToMapping(body.content);
  const doc = new Y.Doc();
  mappingToDoc(doc, draft);
  const problem = checkDoc(doc, atomCount);
  if (problem) throw unprocessable('import_invalid', `The beads do not form a valid draft: ${problem.message}`, problem);
  const name = body.name ?? `${body.mapping.name} (imported)`;
  return createMapping(db, moleculeId, { name, resolution: body.mapping.resolution, description: `Imported from a Beadloom export (sha256 ${body.sha256.slice(0, 12)}…).` }, userId, draft);
}
