import { useId } from 'react';
import { useLocation, useNavigate } from 'react-router';
import { Button } from '../../../components/ui/button';
import { plural } from '../../../lib/format';
import type { TransferReport } from '../../../shared/proposals';

/** What the new-mapping form hands the mapping page after a transfer (router location state). */
export interface TransferReportState {
  transfer: TransferReport;
}

const readState = (state: unknown): TransferReport | null => {
  const t = (state as Partial<TransferReportState> | null)?.transfer;
  return t && Array.isArray(t.carried) && Array.isArray(t.changed) && Array.isArray(t.added) ? t : null;
};
const atoms = (list: number[]) => list.map((a) => a + 1).join(' ');

/**
 * The report of a transfer, right after it made the mapping: which beads were carried over, which
 * source beads only partly matched and were proposed anew, which beads are new, and how many atoms
 * correspond. It stays (a reload keeps the history entry's state) until dismissed; its summary is kept
 * in the mapping's description.
 */
export function TransferReportPanel({ atomCount }: { atomCount: number }) {
  const location = useLocation();
  const navigate = useNavigate();
  const heading = useId();
  const report = readState(location.state);
  if (!report) return null;
  const s = report.source;
  const dismiss = () => void navigate(location.pathname + location.search, { replace: true, state: null });
  return (
    <section aria-labelledby={heading} className="rounded-md border border-ink-200 bg-ink-50/60 px-4 py-3 text-sm text-ink-800">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h2 id={heading} className="font-semibold text-ink-900">
          Transfer report{s ? `: from “${s.mappingName}” of ${s.moleculeName}, ${s.version === null ? 'its draft' : `version ${s.version}${s.production ? ' (production)' : ''}`}` : ''}
        </h2>
        <Button size="sm" variant="ghost" onClick={dismiss}>Dismiss</Button>
      </div>
      <p className="mt-1">
        {report.matchedAtoms} of {atomCount} heavy atoms have a counterpart in the source molecule (maximum common substructure).
        {' '}The summary is kept in the mapping’s description.
      </p>
      <dl className="mt-2 grid gap-x-4 gap-y-1 sm:grid-cols-[max-content_1fr]">
        <dt className="font-semibold">Carried over ({report.carried.length})</dt>
        <dd>{report.carried.length ? report.carried.map((b) => <span key={b.name} className="mr-3 inline-block" title={`atoms ${atoms(b.atoms)}`}>{b.name} <span className="text-ink-600">({plural(b.atoms.length, 'atom')})</span></span>) : 'none'}</dd>
        <dt className="font-semibold">Changed ({report.changed.length})</dt>
        <dd>{report.changed.length ? report.changed.map((b) => <span key={b.name} className="mr-3 inline-block">{b.name} <span className="text-ink-600">({b.matched} of {b.total} atoms matched; proposed anew)</span></span>) : 'none'}</dd>
        <dt className="font-semibold">Newly proposed ({report.added.length})</dt>
        <dd>{report.added.length ? report.added.map((b) => <span key={b.name} className="mr-3 inline-block" title={`atoms ${atoms(b.atoms)}`}>{b.name} <span className="text-ink-600">({plural(b.atoms.length, 'atom')})</span></span>) : 'none'}</dd>
      </dl>
    </section>
  );
}
