import { exportUrl } from '../../../shared/exports';
import type { VersionRef } from '../../../shared/versions';

/** The server's picture of one state of the mapping (the SVG export), optionally with atoms ringed. */
export function VersionPicture({ mappingId, state, highlight = [], alt, className }: { mappingId: number; state: VersionRef; highlight?: number[]; alt: string; className?: string }) {
  return <img src={exportUrl(mappingId, 'svg', state, highlight)} alt={alt} className={className ?? 'max-h-72 w-full rounded border border-paper-300 bg-paper-50 object-contain'} />;
}
