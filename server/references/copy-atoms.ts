import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { referenceDir } from './reference-files';

/** The reference atom (0-based) of each molecule point in every copy: copy after copy (copies.bin). */
export async function readCopyAtoms(dataDir: string, referenceId: number): Promise<Int32Array> {
  const bytes = await readFile(join(referenceDir(dataDir, referenceId), 'copies.bin'));
  return new Int32Array(bytes.buffer, bytes.byteOffset, bytes.length / 4);
}
