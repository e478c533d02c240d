/**
 * evaluateMapping: everything the editor shows for a mapping, from a parsed Molecule.
 *
 * Per bead (a over the bead's atoms with weight w_a):
 *   mass      = Σ w_a · (m_a + Σ m_h)                      (masses.ts, CIAAW 2021)
 *   heavyAtoms= Σ w_a over non-hydrogen atoms
 *   charge    = Σ w_a · q_a
 *   logP      = Σ w_a · atomLogP_a                          (Wildman–Crippen, crippen.ts)
 *   deltaG    = ln(10) · R · T · logP / 1000  [kJ/mol]      (partition.ts)
 *   fragmentLogP: the bead typed as its own capped molecule (fragments.ts)
 * plus size class, type suggestion, centre, the CG topology and the checks. Everything but the
 * fragments is linear in atoms + bonds + bead entries; fragments are cached.
 */
import type { BeadEvaluation, EvaluateOptions, Evaluation, Mapping, Molecule } from '../../src/shared/chem';
import { beadCentre, checkCoordinates } from './centres';
import { runChecks } from './checks';
import { DEMO_LIBRARY } from './demo-library';
import { ChemError } from './errors';
import { fragmentLogP } from './fragments';
import { DEFAULT_TEMPERATURE, partitionFreeEnergy } from './partition';
import { prepare } from './prepared';
import { rdkitIfLoaded } from './rdkit';
import { sizeClassOf } from './resolution';
import { suggestType } from './suggest';
import { beadGraph, topologyOf } from './topology';
import { validateMapping } from './validate-mapping';

export function evaluateMapping(molecule: Molecule, mapping: Mapping, options: EvaluateOptions = {}): Evaluation {
  const temperature = options.temperature ?? DEFAULT_TEMPERATURE;
  if (!Number.isFinite(temperature) || temperature <= 0) {
    throw new ChemError('bad_temperature', `The temperature must be above 0 K; got ${temperature}.`, { temperature });
  }
  const resolution = options.resolution ?? '4:1';
  const library = options.library ?? DEMO_LIBRARY;
  const p = prepare(molecule);
  validateMapping(mapping, p.n);
  const coordinates = options.coordinates ?? null;
  if (coordinates) checkCoordinates(p, coordinates);
  const warnings: string[] = [];
  const rd = options.fragments === false ? null : rdkitIfLoaded();
  if (options.fragments !== false && !rd) warnings.push('RDKit is not loaded yet, so fragment logP was not computed.');

  const weightSum = new Float64Array(p.n);
  const beadsOf: number[][] = Array.from({ length: p.n }, () => []);
  const beads: BeadEvaluation[] = mapping.beads.map((bead, i) => {
    let mass = 0;
    let heavyAtoms = 0;
    let charge = 0;
    let logP = 0;
    for (const { index, weight } of bead.atoms) {
      mass += weight * p.unitMass[index];
      if (p.heavy[index]) heavyAtoms += weight;
      charge += weight * molecule.atoms[index].charge;
      logP += weight * molecule.atomLogP[index];
      weightSum[index] += weight;
      beadsOf[index].push(i);
    }
    const fragment = rd ? fragmentLogP(rd, molecule, p, bead.atoms.map((a) => a.index)) : null;
    const deltaG = partitionFreeEnergy(logP, temperature);
    const fragmentDeltaG = fragment === null ? null : partitionFreeEnergy(fragment, temperature);
    const sizeClass = sizeClassOf(heavyAtoms);
    const suggestion = suggestType(library, sizeClass, charge, fragmentDeltaG ?? deltaG);
    return {
      id: bead.id,
      name: bead.name,
      mass,
      heavyAtoms,
      charge,
      logP,
      fragmentLogP: fragment,
      deltaG,
      fragmentDeltaG,
      sizeClass,
      suggestedType: suggestion?.name ?? null,
      suggestedTypeFits: suggestion ? suggestion.fits : null,
      centre: coordinates ? beadCentre(p, coordinates, bead.atoms, bead.centre) : null,
    };
  });

  const ids = mapping.beads.map((b) => b.id);
  const topology = topologyOf(beadGraph(p, beadsOf, ids.length), ids);
  const checks = runChecks({
    molecule,
    p,
    beads: mapping.beads,
    weightSum,
    beadsOf,
    heavyAtoms: beads.map((b) => b.heavyAtoms),
    resolution,
  });
  return { temperature, resolution, beads, topology, checks, warnings };
}
