/**
 * The per-frame work of an analysis, run in a thread (analysis-worker.ts): for each frame of a chunk
 * and each copy, make the copy whole (unwrap.ts), compute its bead centres (bead-weights.ts, the
 * chemistry core's weights) and every CG term's value (geometry.ts).
 *
 * Frames are independent: the threads of one analysis share a counter of chunks (a SharedArrayBuffer,
 * `task.next`) and each takes the next chunk when it is free, so a thread slowed down by other work
 * on the machine does not leave the other one waiting at the end. The frame loop allocates nothing
 * per copy; each chunk's coordinates are molstar's own columns, decoded only as far as the last atom
 * of the last copy (read-frames.ts).
 */
import { closeSync, openSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { readFrameColumns } from '../references/read-frames';
import { centresOf, type BeadWeights } from '../trajectory/bead-weights';
import { angle, dihedral, distance } from '../trajectory/geometry';
import { wholeCopy } from '../trajectory/unwrap';
import type { AnalysisPart, AnalysisTask } from './analysis-task';

const BOND = 0;
const ANGLE = 1;

export async function analyseFrames(task: AnalysisTask, emit: (part: AnalysisPart) => void): Promise<void> {
  const bytes = await readFile(task.copiesFile);
  const atoms = new Int32Array(bytes.buffer, bytes.byteOffset, bytes.length / 4);
  let needed = 0;
  for (let i = 0; i < atoms.length; i++) if (atoms[i] >= needed) needed = atoms[i] + 1;
  const order = Int32Array.from(task.order);
  const via = Int32Array.from(task.via);
  const bw: BeadWeights = { points: task.beads.map((b) => Int32Array.from(b.points)), weights: task.beads.map((b) => Float64Array.from(b.weights)) };
  const nb = task.beads.length;
  const nt = task.terms.length;
  const kinds = Int8Array.from(task.terms, (t) => (t.kind === 'bond' ? BOND : t.kind === 'angle' ? ANGLE : 2));
  const termBeads = new Int32Array(4 * nt);
  task.terms.forEach((t, ti) => t.beads.forEach((b, k) => (termBeads[4 * ti + k] = b)));
  const { copies, atomsPerCopy: apc } = task;
  const whole = new Float64Array(3 * apc);
  const here = new Float64Array(3 * nb);
  const next = task.next ? new Int32Array(task.next) : null;
  const chunks = Math.ceil((task.to - task.from) / task.chunk);
  // One descriptor for the whole task, read synchronously (this thread has nothing else to do).
  const fd = openSync(task.source.path, 'r');
  try {
    for (let k = 0; ; k++) {
      const chunk = next ? Atomics.add(next, 0, 1) : k;
      if (chunk >= chunks) break;
      const from = task.from + chunk * task.chunk;
      const to = Math.min(task.to, from + task.chunk);
      const frames = await readFrameColumns(fd, task.index, from, to, needed);
      const nf = to - from;
      const centres = new Float32Array(nf * copies * nb * 3);
      const values = new Float32Array(nt * nf * copies);
      for (let f = 0; f < nf; f++) {
        const { x, y, z, box } = frames[f];
        for (let c = 0; c < copies; c++) {
          wholeCopy(x, y, z, atoms, c * apc, order, via, box, whole);
          centresOf(bw, whole, here, 0);
          const at = (f * copies + c) * nb * 3;
          for (let i = 0; i < 3 * nb; i++) centres[at + i] = here[i] / 10;
          for (let ti = 0; ti < nt; ti++) {
            const b = 4 * ti;
            const kind = kinds[ti];
            const v =
              kind === BOND
                ? distance(here, termBeads[b], termBeads[b + 1]) / 10
                : kind === ANGLE
                  ? angle(here, termBeads[b], termBeads[b + 1], termBeads[b + 2])
                  : dihedral(here, termBeads[b], termBeads[b + 1], termBeads[b + 2], termBeads[b + 3]);
            values[ti * nf * copies + f * copies + c] = v;
          }
        }
      }
      emit({ from, to, centres, values });
    }
  } finally {
    closeSync(fd);
  }
}
