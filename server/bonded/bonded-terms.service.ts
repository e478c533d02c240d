import type { Db } from '../db/knex';
import type { DraftAccess } from '../mappings/draft-access';
import type { Rooms } from '../drafts/rooms';
import type { BondedParams, BondedTerm, BondedTermsView, TermKind } from '../../src/shared/bonded-terms';
import { planFill, type BondedFillView, type FillReport } from '../../src/shared/bonded-fill';
import { BEADS_PER_TERM, bondedRows, termKey, topologyTermIds } from '../../src/shared/bonded-terms';
import type { Mapping, Molecule, Topology } from '../../src/shared/chem';
import { readBonded, setBonded } from '../../src/shared/mapping-doc';
import { conflict, notFound, unprocessable } from '../http/errors';
import { junctionOf, junctionTerms, parseUnitRef, unitRef } from '../../src/shared/repeat-chain';
import { finishedAnalysisOf, mappingForExport } from '../exports/exports.service';
import { parseModel } from '../molecules/molecule-view';
import { assertUnlocked } from '../mappings/mappings.service';

// The bonded-terms table of a mapping's draft. The terms live in the draft document (mapping-doc.ts),
// so reading is reading the draft and writing is a server-side edit of the live room, stored and
// relayed like a person's edit and saved with every version (docs/exports.md, "Bonded terms").

/** The topology the table lists: the draft's latest evaluation. */
function topologyOf(result: { evaluation: { topology: Topology } | null; error: { message: string } | null }): Topology {
  if (!result.evaluation) throw conflict('not_evaluated', `The draft has no evaluation yet, so no CG topology to list${result.error ? `: ${result.error.message}` : ''}.`);
  return result.evaluation.topology;
}

/** The terms across the junction of a repeat unit's chain (none for other molecules). */
export function junctionTermIds(model: Molecule, draft: Mapping, topology: Topology): { kind: TermKind; ids: string[] }[] {
  const junction = model.repeatUnit ? junctionOf(model, draft.beads) : null;
  return junction ? junctionTerms(topology, draft.beads.map((b) => b.id), junction) : [];
}

export function bondedView(draft: Mapping, topology: Topology, junction: { kind: TermKind; ids: string[] }[] = []): BondedTermsView {
  const names = new Map(draft.beads.map((b) => [b.id, b.name]));
  const name = (ref: string) => {
    const { id, unit } = parseUnitRef(ref);
    return unitRef(names.get(id) ?? id, unit);
  };
  return { terms: bondedRows(topology, draft.bonded ?? {}, name, junction), exclusions: draft.exclusions ?? null };
}

async function moleculeOf(db: Db, mappingId: number): Promise<Molecule> {
  const row = await mappingForExport(db, mappingId);
  if (!row) throw notFound('That mapping');
  return parseModel({ id: row.molecule_id, model: row.model });
}

export async function readBondedTerms(db: Db, drafts: DraftAccess, mappingId: number): Promise<BondedTermsView> {
  const { draft, result } = await drafts.read(mappingId);
  const topology = topologyOf(result);
  return bondedView(draft, topology, junctionTermIds(await moleculeOf(db, mappingId), draft, topology));
}

/** Turns rows named by bead names into stored entries; every problem is named (422 with details). */
export function entriesOf(draft: Mapping, topology: Topology, terms: readonly BondedTerm[], junction: { kind: TermKind; ids: string[] }[] = []): Record<string, BondedParams> {
  const byName = new Map<string, string[]>();
  for (const b of draft.beads) byName.set(b.name, [...(byName.get(b.name) ?? []), b.id]);
  const known = new Set([...topologyTermIds(topology), ...junction].map(({ kind, ids }) => termKey(kind, ids)));
  const problems: { term: number; message: string }[] = [];
  const entries: Record<string, BondedParams> = {};
  terms.forEach((t, i) => {
    const ids: string[] = [];
    for (const ref of t.beads) {
      // "A+" names bead A of the next repeat unit (junction terms); a bead's own name wins if it ends in '+'.
      const { id: name, unit } = byName.has(ref) ? { id: ref, unit: 0 } : parseUnitRef(ref);
      const found = byName.get(name) ?? [];
      if (found.length === 0) problems.push({ term: i, message: `No bead is named "${name}".` });
      else if (found.length > 1) problems.push({ term: i, message: `${found.length} beads are named "${name}"; rename them apart first.` });
      else ids.push(unitRef(found[0], unit));
    }
    if (ids.length !== BEADS_PER_TERM[t.kind]) return;
    const key = termKey(t.kind, ids);
    if (t.kind === 'improper') {
      if (new Set(ids).size !== 4) problems.push({ term: i, message: 'An improper dihedral joins four different beads.' });
    } else if (!known.has(key)) problems.push({ term: i, message: `${t.beads.join('–')} is not a ${t.kind} of the draft's topology.` });
    if (key in entries) problems.push({ term: i, message: `${t.kind} ${t.beads.join('–')} is listed twice.` });
    const { kind: _kind, beads: _beads, ...params } = t;
    entries[key] = params;
  });
  if (problems.length > 0) throw unprocessable('bonded_terms_invalid', problems.map((p) => `term ${p.term + 1}: ${p.message}`).join(' '), { problems });
  return entries;
}

/** PUT: the table becomes exactly these terms (and exclusion count, when given). */
export async function writeBondedTerms(db: Db, rooms: Rooms, drafts: DraftAccess, mappingId: number, body: { terms: BondedTerm[]; exclusions?: number | null }, userId: number): Promise<BondedTermsView> {
  await assertUnlocked(db, mappingId);
  const room = await rooms.open(mappingId);
  if (!room) throw notFound('That mapping');
  try {
    const { result } = await drafts.read(mappingId);
    const topology = topologyOf(result);
    const model = await moleculeOf(db, mappingId);
    await room.editDraft((next, current) => {
      const entries: Record<string, BondedParams | null> = entriesOf(current, topology, body.terms, junctionTermIds(model, current, topology));
      for (const key of Object.keys(readBonded(next))) if (!(key in entries)) entries[key] = null;
      setBonded(next, entries, body.exclusions);
    }, userId);
  } finally {
    await room.releaseIfIdle();
  }
  return readBondedTerms(db, drafts, mappingId);
}

/**
 * PUT { fromAnalysis }: the rows the analysis has fitted values for get them (src/shared/bonded-fill.ts
 * says which values and why), in one edit of the live draft; the answer says what was filled, which
 * analysis terms were not used and which rows the analysis does not cover (left as they were).
 */
export async function fillFromAnalysis(db: Db, rooms: Rooms, drafts: DraftAccess, mappingId: number, analysisId: number, userId: number): Promise<BondedFillView> {
  const analysis = await finishedAnalysisOf(db, mappingId, analysisId);
  await assertUnlocked(db, mappingId);
  const room = await rooms.open(mappingId);
  if (!room) throw notFound('That mapping');
  let report: FillReport = { analysisId, filled: [], skipped: [], missing: [] };
  try {
    const { result } = await drafts.read(mappingId);
    const topology = topologyOf(result);
    const model = await moleculeOf(db, mappingId);
    await room.editDraft((next, current) => {
      const junction = junctionTermIds(model, current, topology);
      const rows = bondedView(current, topology, junction).terms;
      // bondedView lists the topology's terms, then the junction's, in this order: the same keys.
      const keys = [...topologyTermIds(topology), ...junction].map(({ kind, ids }) => termKey(kind, ids));
      const plan = planFill(rows, analysis.result);
      report = { analysisId, filled: plan.filled, skipped: plan.skipped, missing: plan.missing };
      if (plan.updates.length > 0) setBonded(next, Object.fromEntries(plan.updates.map((u) => [keys[u.row], u.params])));
    }, userId);
  } finally {
    await room.releaseIfIdle();
  }
  return { ...(await readBondedTerms(db, drafts, mappingId)), fill: report };
}
