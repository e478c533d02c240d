import { JSON_SCHEMA_PATH, versionContent } from '../../src/shared/exports';
import type { ExportSource } from './export-source';

// The JSON export (schema: public/schemas/beadloom-mapping-v1.json). `content` is exactly what
// `sha256` covers: SHA-256 of the UTF-8 bytes of JSON.stringify(content), keys in the order written.
// Atom numbers are 1-based, in the molecule's heavy-atom order. `evaluation` is the server's
// evaluation of that state (topology bonds name bead ids) (null when it could not be evaluated).
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
      atoms: s.model.atoms.map((a) => ({ number: a.index + 1, element: a.element, charge: a.charge, hydrogens: a.hydrogens })),
    },
    content: versionContent(s.canonicalSmiles, s.draft),
    sha256: s.sha256,
    evaluation: e
      ? {
          temperature: e.temperature,
          beads: e.beads.map((b) => ({
            id: b.id,
            name: b.name,
            mass: b.mass,
            heavyAtoms: b.heavyAtoms,
            charge: b.charge,
            logP: b.logP,
            fragmentLogP: b.fragmentLogP,
            deltaG: b.deltaG,
            suggestedType: b.suggestedType,
            centre: b.centre,
          })),
          topology: { bonds: e.topology.bonds, angles: e.topology.angles.length, dihedrals: e.topology.dihedrals.length },
          checks: e.checks.map((c) => ({ code: c.code, severity: c.severity, message: c.message })),
        }
      : null,
  };
}
