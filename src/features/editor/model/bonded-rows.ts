import * as Y from 'yjs';
import { useSyncExternalStore } from 'react';
import type { Molecule, Topology } from '../../../shared/chem';
import { bondedRows, type BondedTerm } from '../../../shared/bonded-terms';
import { BONDED, SETTINGS, docToMapping } from '../../../shared/mapping-doc';
import { junctionOf, junctionTerms, parseUnitRef, unitRef } from '../../../shared/repeat-chain';

/** A row of the editor's table: the API's row plus the draft key it is stored under (bead ids). */
export interface EditorBondedRow extends BondedTerm {
  key: string;
}

/** The table's rows for the draft and its latest topology (junction terms of a repeat unit included). */
export function editorBondedRows(doc: Y.Doc, topology: Topology, molecule: Pick<Molecule, 'atoms' | 'bonds' | 'attachmentPoints' | 'repeatUnit'>): { rows: EditorBondedRow[]; exclusions: number | null } {
  const draft = docToMapping(doc);
  const names = new Map(draft.beads.map((b) => [b.id, b.name]));
  const junction = molecule.repeatUnit ? junctionOf(molecule, draft.beads) : null;
  const extra = junction ? junctionTerms(topology, draft.beads.map((b) => b.id), junction) : [];
  const ids: string[] = [];
  const rows = bondedRows(topology, draft.bonded ?? {}, (ref) => {
    ids.push(ref);
    const { id, unit } = parseUnitRef(ref);
    return unitRef(names.get(id) ?? id, unit);
  }, extra);
  // bondedRows names beads in row order: rebuild each row's key from the ids it was given.
  let at = 0;
  const keyed = rows.map((r) => {
    const own = ids.slice(at, at + r.beads.length);
    at += r.beads.length;
    return { ...r, key: `${r.kind}:${own.join(',')}` };
  });
  return { rows: keyed, exclusions: draft.exclusions ?? null };
}

/** A number that changes whenever the draft's bonded terms or settings change (for re-rendering). */
export function useBondedRevision(doc: Y.Doc): number {
  return useSyncExternalStore(
    (notify) => {
      const bump = () => {
        revisions.set(doc, (revisions.get(doc) ?? 0) + 1);
        notify();
      };
      const bonded = doc.getMap(BONDED);
      const settings = doc.getMap(SETTINGS);
      const beads = doc.getMap('beads');
      bonded.observe(bump);
      settings.observe(bump);
      beads.observeDeep(bump);
      return () => {
        bonded.unobserve(bump);
        settings.unobserve(bump);
        beads.unobserveDeep(bump);
      };
    },
    () => revisions.get(doc) ?? 0,
  );
}
const revisions = new WeakMap<Y.Doc, number>();
