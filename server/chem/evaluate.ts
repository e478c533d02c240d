/**
 * evaluateMapping: everything the editor shows for a mapping, from a parsed Molecule.
 *
 * Per bead (a over the bead's atoms with weight w_a):
 *   mass      = Σ w_a · (m_a + Σ m_h)                      (masses.ts, CIAAW 2021)
 *   heavyAtoms= Σ w_a over non-hydrogen atoms
 *   charge    = Σ w_a · q_a   (exact; ionic when not 0)
 *   logP      = Σ w_a · atomLogP_a                          (Wildman–Crippen, crippen.ts)
 *   deltaG    = ln(10) · R · T · logP / 1000  [kJ/mol]      (partition.ts)
 *   fragmentLogP: the bead typed as its own capped molecule (fragments.ts)
 * An ionic bead has no partition value: logP, deltaG and the fragment values are null and the raw sum
 * stays in `additiveLogPIonic` for reference. The partition value a bead's suggestion and the exports
 * use is, in order: the modeller's measured value, the mapping's basis (fragment or atom sum), the
 * other estimate. Plus size class, type suggestion, centre, the CG topology and the checks.
 * Everything but the fragments is linear in atoms + bonds + bead entries; fragments are cached.
 */
import type { BeadEvaluation, EvaluateOptions, Evaluation, Mapping, MappingBead, Molecule, PartitionBasis, PartitionSource } from '../../src/shared/chem';
import { beadCentre, checkCoordinates } from './centres';
import { runChecks } from './checks';
import { bondedChecks } from './bonded-checks';
import { DEMO_LIBRARY } from './demo-library';
import { ChemError } from './errors';
import { fragmentLogP } from './fragments';
import { DEFAULT_TEMPERATURE, logPFromFreeEnergy, partitionFreeEnergy } from './partition';
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
  const partitionBasis: PartitionBasis = mapping.partitionBasis ?? 'fragment';
  const p = prepare(molecule);
  validateMapping(mapping, p.n);
  const coordinates = options.coordinates ?? null;
  if (coordinates) checkCoordinates(p, coordinates);
  const warnings: string[] = [];
  const rd = options.fragments === false ? null : rdkitIfLoaded();
  if (options.fragments !== false && !rd) warnings.push('RDKit is not loaded yet, so fragment logP was not computed.');
  const dG = (logP: number | null) => (logP === null ? null : partitionFreeEnergy(logP, temperature));

  const weightSum = new Float64Array(p.n);
  const beadsOf: number[][] = Array.from({ length: p.n }, () => []);
  const beads: BeadEvaluation[] = mapping.beads.map((bead, i) => {
    let mass = 0;
    let heavyAtoms = 0;
    let charge = 0;
    let additive = 0;
    for (const { index, weight } of bead.atoms) {
      mass += weight * p.unitMass[index];
      if (p.heavy[index]) heavyAtoms += weight;
      charge += weight * molecule.atoms[index].charge;
      additive += weight * molecule.atomLogP[index];
      weightSum[index] += weight;
      beadsOf[index].push(i);
    }
    charge = exact(charge);
    const ionic = charge !== 0;
    const fragment = rd && !ionic ? fragmentLogP(rd, molecule, p, bead.atoms.map((a) => a.index)) : null;
    const logP = ionic ? null : additive;
    const measuredLogP = measuredAsLogP(bead);
    const chosen = choosePartition(ionic, measuredLogP, partitionBasis, logP, fragment);
    const sizeClass = sizeClassOf(heavyAtoms);
    const suggestion = suggestType(library, sizeClass, charge, ionic, dG(chosen.logP));
    return {
      id: bead.id,
      name: bead.name,
      mass,
      heavyAtoms,
      charge,
      ionic,
      logP,
      additiveLogPIonic: ionic ? additive : null,
      fragmentLogP: fragment,
      deltaG: dG(logP),
      fragmentDeltaG: dG(fragment),
      measuredLogP,
      measuredDeltaG: dG(measuredLogP),
      measuredSource: bead.measured?.source ?? null,
      partitionSource: chosen.source,
      partitionLogP: chosen.logP,
      partitionDeltaG: dG(chosen.logP),
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
    evaluated: beads,
    library,
    weightSum,
    beadsOf,
    heavyAtoms: beads.map((b) => b.heavyAtoms),
    resolution,
  });
  checks.push(...bondedChecks(mapping, topology, molecule));
  return { temperature, resolution, partitionBasis, beads, topology, checks, warnings };
}

/** Drops floating-point noise from a weighted charge sum (weights are given to at most ~9 digits). */
function exact(v: number): number {
  const r = Math.round(v * 1e9) / 1e9;
  return r === 0 ? 0 : r;
}

/** A measured value as logP at 298.15 K (a measured ΔG is read at 298.15 K; partition.ts). */
function measuredAsLogP(bead: MappingBead): number | null {
  const m = bead.measured;
  if (!m) return null;
  return m.kind === 'logP' ? m.value : logPFromFreeEnergy(m.value, DEFAULT_TEMPERATURE);
}

function choosePartition(ionic: boolean, measured: number | null, basis: PartitionBasis, atoms: number | null, fragment: number | null): { source: PartitionSource | null; logP: number | null } {
  if (measured !== null) return { source: 'measured', logP: measured };
  if (ionic) return { source: 'ionic', logP: null };
  const first = basis === 'fragment' ? fragment : atoms;
  if (first !== null) return { source: basis, logP: first };
  const other = basis === 'fragment' ? atoms : fragment;
  return other !== null ? { source: basis === 'fragment' ? 'atoms' : 'fragment', logP: other } : { source: null, logP: null };
}
