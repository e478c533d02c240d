import type { ConnectionState } from '../collab/mapping-session';
import { textOn } from '../../../shared/drawing/contrast';
import { initials, type Peer } from '../model/presence';

const CONNECTION: Record<ConnectionState, { label: string; dot: string; hint: string }> = {
  connecting: { label: 'Connecting', dot: 'bg-paper-400', hint: 'Opening the live draft…' },
  live: { label: 'Live', dot: 'bg-ok-600', hint: 'Your edits reach everyone as you make them.' },
  reconnecting: { label: 'Reconnecting', dot: 'bg-bead-orange animate-pulse', hint: 'The connection dropped; your edits are kept and sent when it returns.' },
  'read-only': { label: 'Read-only', dot: 'bg-ink-400', hint: 'You are watching live; editing is off.' },
  closed: { label: 'Disconnected', dot: 'bg-alert-600', hint: 'The live draft is closed.' },
};

export function ConnectionBadge({ state, reason }: { state: ConnectionState; reason?: string | null }) {
  const c = CONNECTION[state];
  return (
    <p role="status" aria-live="polite" title={reason ?? c.hint} className="inline-flex items-center gap-2 rounded-full border border-paper-300 bg-paper-50 px-3 py-1 text-sm font-semibold text-ink-800">
      <span aria-hidden="true" className={`size-2.5 rounded-full ${c.dot}`} />
      <span data-connection={state}>{c.label}</span>
      {reason && <span className="font-normal text-ink-600">— {reason}</span>}
    </p>
  );
}

/** Everyone in the mapping, each with the colour their selection and pointer carry on the canvas. */
export function PresenceList({ peers }: { peers: readonly Peer[] }) {
  return (
    <ul aria-label="People in this mapping" className="flex items-center -space-x-1.5">
      {peers.map((p) => (
        <li key={p.clientId} aria-label={`${p.user.name}${p.isLocal ? ' (you)' : ''}${p.selection.length ? `, ${p.selection.length} atoms selected` : ''}`} title={`${p.user.name}${p.isLocal ? ' (you)' : ''}`}>
          <span
            aria-hidden="true"
            className="flex size-8 items-center justify-center rounded-full border-2 border-paper-50 text-xs font-bold shadow-card"
            style={{ background: p.user.colour, color: textOn(p.user.colour) }}
          >
            {initials(p.user.name)}
          </span>
        </li>
      ))}
    </ul>
  );
}
