import type { Writable } from 'node:stream';
import type { Db } from '../db/knex';
import { EXPORT_FORMATS } from '../../src/shared/exports';
import type { DraftAccess } from '../mappings/draft-access';
import { exportSource, stateLabel } from './export-source';
import { renderExport, slug } from './render';
import { projectMappings } from './exports.service';

// The project download: every mapping's locked production version in every export format, one
// folder per mapping ("<molecule>/<mapping>-v<N>/"), and manifest.json listing what is inside with
// each version's SHA-256. Mappings without a production version are listed as skipped.
export async function writeProjectZip(db: Db, drafts: DraftAccess, projectId: number, out: Writable): Promise<void> {
  const rows = await projectMappings(db, projectId);
  // Loaded on first use: the archiver package is large and most processes never build a zip.
  const { ZipArchive } = await import('archiver');
  const zip = new ZipArchive({ zlib: { level: 6 } });
  const done = new Promise<void>((resolve, reject) => {
    zip.on('error', reject);
    out.on('finish', resolve);
    out.on('error', reject);
  });
  zip.pipe(out);
  const manifest: unknown[] = [];
  const used = new Set<string>();
  for (const r of rows) {
    if (!r.locked) {
      manifest.push({ molecule: r.molecule_name, mapping: r.name, mappingId: r.id, skipped: 'no production version' });
      continue;
    }
    const source = await exportSource(db, drafts, r.id, 'production');
    let folder = `${slug(r.molecule_name)}/${slug(r.name)}-${stateLabel(source)}`;
    if (used.has(folder)) folder += `-${r.id}`;
    used.add(folder);
    const files = EXPORT_FORMATS.map((format) => renderExport(source, format));
    for (const f of files) zip.append(f.body, { name: `${folder}/${f.name}` });
    manifest.push({ molecule: r.molecule_name, mapping: r.name, mappingId: r.id, version: source.version, sha256: source.sha256, files: files.map((f) => `${folder}/${f.name}`) });
  }
  zip.append(JSON.stringify({ format: 'beadloom-project-export', projectId, exportedAt: new Date().toISOString(), mappings: manifest }, null, 2) + '\n', { name: 'manifest.json' });
  await zip.finalize();
  await done;
}
