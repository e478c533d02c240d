import { JSON_SCHEMA_PATH, versionContent, type ExportAtom, type ExportBond } from '../../src/shared/exports';
import type { MappingBead, Topology } from '../../src/shared/chem';
import type { ExportSource } from './export-source';
import { IONIC } from './csv';

// The JSON export (schema: public/schemas/beadloom-mapping-v1.json). `content` is exactly what
// `sha256` covers: SHA-256 of the UTF-8 bytes of JSON.stringify(content), keys in the order written.
// Atom numbers are 1-based, in the molecule's heavy-atom order. `molecule.atoms` and `molecule.bonds`
// are the molecule's graph (hydrogens folded into their atoms): an import places the beads by
// matching it. `evaluation` is the server's evaluation of that state (null when it could not be
// evaluated); its topology lists the CG terms as tuples of bead names.
export function toJsonExport(s: ExportSource, exportedAt = new Date()) {
  const e = s.evaluation;
  return {
    $schema: JSON_SCHEMA_PATH,
    format: 'beadloom-mapping' as const,
    formatVersion: 1 as const,
    exportedAt: exportedAt.toISOString(),
    mapping: { id: s.mappingId, name: s.mappingName, resolution: s.resolution, version: s.version, production: s.production },
    molecule: {
      name: s.moleculeName,
      canonicalSmiles: s.canonicalSmiles,
      formula: s.model.formula,
      heavyAtoms: s.model.atoms.length,
      atoms: s.model.atoms.map((a): ExportAtom => ({ number: a.index + 1, element: a.element, isotope: a.isotope, charge: a.charge, hydrogens: a.hydrogens })),
      bonds: s.model.bonds.map((b): ExportBond => ({ a: b.a + 1, b: b.b + 1, order: b.order, aromatic: b.aromatic })),
    },
    content: versionContent(s.canonicalSmiles, s.draft),
    sha256: s.sha256,
    evaluation: e
      ? {
          temperature: e.temperature,
          partitionBasis: e.partitionBasis ?? 'fragment',
          beads: e.beads.map((b) => {
            // An ionic bead has no partition value: "n/a (ionic)" where a number would be; the raw
            // additive sum stays under its own name, for reference only.
            const value = (v: number | null) => (b.ionic ? IONIC : v);
            return {
              id: b.id,
              name: b.name,
              mass: b.mass,
              heavyAtoms: b.heavyAtoms,
              charge: b.charge,
              ionic: !!b.ionic,
              logP: value(b.logP),
              fragmentLogP: value(b.fragmentLogP),
              deltaG: value(b.deltaG),
              fragmentDeltaG: value(b.fragmentDeltaG ?? null),
              additiveLogPIonic: b.additiveLogPIonic ?? null,
              measured: b.measuredLogP === null || b.measuredLogP === undefined ? null : { logP: b.measuredLogP, deltaG: b.measuredDeltaG, source: b.measuredSource },
              partitionSource: b.partitionSource ?? null,
              partitionDeltaG: b.partitionSource === 'ionic' ? IONIC : (b.partitionDeltaG ?? null),
              suggestedType: b.suggestedType,
              centre: b.centre,
            };
          }),
          topology: namedTopology(e.topology, s.draft.beads),
          checks: e.checks.map((c) => ({ code: c.code, severity: c.severity, message: c.message })),
        }
      : null,
  };
}

/**
 * The CG terms with bead names instead of ids. A name two beads share is written "name (id)" so
 * every tuple still says which beads it joins.
 */
export function namedTopology(t: Topology, beads: readonly MappingBead[]) {
  const count = new Map<string, number>();
  for (const b of beads) count.set(b.name, (count.get(b.name) ?? 0) + 1);
  const label = new Map(beads.map((b) => [b.id, count.get(b.name)! > 1 ? `${b.name} (${b.id})` : b.name]));
  const names = (ids: readonly string[]) => ids.map((id) => label.get(id) ?? id);
  return { bonds: t.bonds.map(names), angles: t.angles.map(names), dihedrals: t.dihedrals.map(names), rings: t.rings.map(names) };
}
