/**
 * Checks of a mapping's bonded terms against its CG topology (src/shared/bonded-terms.ts). An engine
 * cannot run a term without its numbers, and Beadloom never fills one in silently: once the modeller
 * has started the table (any term or the exclusion count stored), every term still lacking a value,
 * force constant or multiplicity is an error-level check, and so is a missing exclusion count. Before
 * that there is no check at all: a mapping used only for its beads is not wrong, and an engine export
 * of it is refused with the missing values named (server/exports/engine-model.ts).
 */
import type { Check, Mapping, Molecule, Topology } from '../../src/shared/chem';
import { defaultFunction, missingValues, termKey, topologyTermIds } from '../../src/shared/bonded-terms';
import { junctionOf, junctionTerms, parseUnitRef } from '../../src/shared/repeat-chain';

export function bondedChecks(mapping: Pick<Mapping, 'beads' | 'bonded' | 'exclusions'>, topology: Topology, molecule?: Pick<Molecule, 'atoms' | 'bonds' | 'attachmentPoints' | 'repeatUnit'>): Check[] {
  // A repeat unit's table also holds the terms across the junction to the next unit ("A+").
  const junction = molecule?.repeatUnit ? junctionOf(molecule, mapping.beads) : null;
  const terms = [...topologyTermIds(topology), ...(junction ? junctionTerms(topology, mapping.beads.map((b) => b.id), junction) : [])];
  if (terms.length === 0) return [];
  const stored = mapping.bonded ?? {};
  const names = new Map(mapping.beads.map((b) => [b.id, b.name]));
  const started = Object.keys(stored).length > 0 || mapping.exclusions !== undefined;
  if (!started) return [];
  const checks: Check[] = [];
  for (const { kind, ids } of terms) {
    const p = stored[termKey(kind, ids)] ?? { function: defaultFunction(kind), value: null, k: null };
    const missing = missingValues({ kind, ...p });
    if (missing.length === 0) continue;
    const label = ids.map((ref) => {
      const { id, unit } = parseUnitRef(ref);
      return `${names.get(id) ?? id}${'+'.repeat(unit)}`;
    }).join('–');
    checks.push({ code: 'bonded_value_missing', severity: 'error', message: `${kind} ${label}: no ${missing.join(', no ')}.`, atoms: [], beads: [...new Set(ids.map((r) => parseUnitRef(r).id))], hint: 'Type the value in the bonded-terms table, fill it from an analysis, or (angles, dihedrals) leave the term out.' });
  }
  if (mapping.exclusions === undefined) checks.push({ code: 'exclusions_missing', severity: 'error', message: 'No exclusion count set.', atoms: [], beads: [], hint: 'Set how many bonds apart non-bonded pairs stay excluded (GROMACS nrexcl).' });
  return checks;
}
