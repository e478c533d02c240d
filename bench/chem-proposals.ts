/**
 * Proposal part of the chemistry benchmark (bench/chem.ts; `BENCH_CHEM=proposals npm run bench:chem`
 * runs only this part): time to propose a mapping for molecules of about 20, 100 and 1,000 heavy
 * atoms, with the partition alone (propose.ts) and as the API serves it (propose-mapping.ts: names
 * and library types, which evaluates the proposal with fragment typing). Each run gets a fresh copy of
 * the molecule, so no per-molecule cache helps. Targets (issue 17): < 200 ms at 100 heavy atoms and
 * < 2 s at 1,000. Nothing is asserted.
 */
import os from 'node:os';
import { parseMolecule, type Molecule } from '../server/chem/index';
import { proposePartitions } from '../server/chem/propose';
import { proposeMapping } from '../server/chem/propose-mapping';

/** The same test polymer as bench/chem.ts: styrene, acrylic acid and ethylene oxide (18 heavy atoms a unit). */
const polymer = (units: number) => 'C' + 'CC(c1ccccc1)CC(C(=O)O)COCCO'.repeat(units) + 'C';

const CASES = [
  { label: '~20 (diazepam)', smiles: 'CN1C(=O)CN=C(c2ccccc2)c2cc(Cl)ccc12' },
  { label: '~100 (polymer ×5)', smiles: polymer(5) + 'CCCCCC' },
  { label: '~1000 (polymer ×55)', smiles: polymer(55) },
];

function medianOf(reps: number, molecule: Molecule, f: (m: Molecule) => unknown): number {
  const times: number[] = [];
  for (let i = 0; i < reps; i++) {
    const fresh = structuredClone(molecule);
    const t = performance.now();
    f(fresh);
    times.push(performance.now() - t);
  }
  return times.sort((a, b) => a - b)[Math.floor(times.length / 2)];
}

const fmt = (ms: number): string => (ms >= 100 ? ms.toFixed(0) : ms.toFixed(1));

export async function proposalSection(): Promise<string> {
  const rows: string[] = [];
  const loadAtStart = os.loadavg()[0];
  for (const c of CASES) {
    const m = await parseMolecule({ smiles: c.smiles });
    const reps = m.atoms.length > 500 ? 3 : 7;
    proposePartitions(structuredClone(m), { resolution: '4:1' }); // warm the code paths, not counted
    const partition = medianOf(reps, m, (x) => proposePartitions(x, { resolution: '4:1' }));
    const served = medianOf(reps, m, (x) => proposeMapping(x, { resolution: '4:1', scope: 'all', draft: { beads: [] } }));
    const beads = proposePartitions(m, { resolution: '4:1' })[0].beads.length;
    rows.push(`| ${c.label} | ${m.heavyAtoms} | ${beads} | ${fmt(partition)} | ${fmt(served)} |`);
    console.error(`done: proposal ${c.label}`);
  }
  return [
    `Measured ${new Date().toISOString().slice(0, 10)} on ${os.cpus().length} × ${os.cpus()[0]?.model ?? 'CPU'}, Node ${process.version}, load average ${loadAtStart.toFixed(1)} at the start and ${os.loadavg()[0].toFixed(1)} at the end (the machine was shared). Medians, 4:1, whole molecule, best and up to two alternatives.`,
    '',
    '| molecule | heavy atoms | beads (best) | partition (propose.ts), ms | as served: names + library types (fragments typed), ms |',
    '|---|---:|---:|---:|---:|',
    ...rows,
    '',
    'Targets (issue 17): < 200 ms at 100 heavy atoms, < 2 s at 1,000.',
  ].join('\n');
}
