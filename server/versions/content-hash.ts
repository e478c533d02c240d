import { createHash } from 'node:crypto';
import type { Mapping } from '../../src/shared/chem';
import { contentText, versionContent } from '../../src/shared/exports';

/** SHA-256 (hex) of the UTF-8 bytes of the content text (see src/shared/exports.ts, docs/exports.md). */
export function contentSha256(canonicalSmiles: string, mapping: Mapping): string {
  return createHash('sha256').update(contentText(versionContent(canonicalSmiles, mapping)), 'utf8').digest('hex');
}
