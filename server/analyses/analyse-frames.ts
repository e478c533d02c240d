/**
 * The per-frame work of an analysis, run in a thread (analysis-worker.ts): for each frame of a chunk
 * and each copy, make the copy whole (unwrap.ts), compute its bead centres (bead-weights.ts, the
 * chemistry core's weights) and every CG term's value (geometry.ts). Frames are independent, so two
 * threads take halves of the trajectory.
 */
import { readFile } from 'node:fs/promises';
import { readFrames } from '../references/read-frames';
import { centresOf, type BeadWeights } from '../trajectory/bead-weights';
import { angle, dihedral, distance } from '../trajectory/geometry';
import { wholeCopy } from '../trajectory/unwrap';
import type { AnalysisPart, AnalysisTask } from './analysis-task';

export async function analyseFrames(task: AnalysisTask, emit: (part: AnalysisPart) => void): Promise<void> {
  const bytes = await readFile(task.copiesFile);
  const all = new Int32Array(bytes.buffer, bytes.byteOffset, bytes.length / 4);
  const copies = Array.from({ length: task.copies }, (_, c) => all.subarray(c * task.atomsPerCopy, (c + 1) * task.atomsPerCopy));
  const order = Int32Array.from(task.order);
  const via = Int32Array.from(task.via);
  const bw: BeadWeights = { points: task.beads.map((b) => Int32Array.from(b.points)), weights: task.beads.map((b) => Float64Array.from(b.weights)) };
  const nb = task.beads.length;
  const whole = new Float64Array(3 * task.atomsPerCopy);
  const here = new Float64Array(3 * nb);
  for (let from = task.from; from < task.to; from += task.chunk) {
    const to = Math.min(task.to, from + task.chunk);
    const frames = await readFrames(task.source.path, task.index, from, to);
    const nf = to - from;
    const centres = new Float32Array(nf * task.copies * nb * 3);
    const values = new Float32Array(task.terms.length * nf * task.copies);
    frames.forEach((frame, f) => {
      for (let c = 0; c < task.copies; c++) {
        wholeCopy(frame.xyz, copies[c], order, via, frame.box, whole);
        centresOf(bw, whole, here, 0);
        const at = (f * task.copies + c) * nb * 3;
        for (let k = 0; k < 3 * nb; k++) centres[at + k] = here[k] / 10;
        task.terms.forEach((t, ti) => {
          const b = t.beads;
          const v = t.kind === 'bond' ? distance(here, b[0], b[1]) / 10 : t.kind === 'angle' ? angle(here, b[0], b[1], b[2]) : dihedral(here, b[0], b[1], b[2], b[3]);
          values[ti * nf * task.copies + f * task.copies + c] = v;
        });
      }
    });
    emit({ from, to, centres, values });
  }
}
