import { useEffect, useId, useState, type RefObject } from 'react';
import { Button } from '../../../components/ui/button';
import type { Proposal, ProposalScope } from '../../../shared/proposals';
import { useProposeMapping } from '../api/propose-mapping';
import type { MappingSession } from '../collab/mapping-session';
import { ghostShares, type GhostBead, type PeerGhosts } from '../model/proposal-ghosts';
import { acceptGhosts, closeProposal, dismissGhosts, openProposal } from '../../../shared/proposal-doc';
import { presenceColour } from '../../../shared/presence-colour';

interface ProposalPanelProps {
  session: MappingSession;
  mappingId: number;
  readOnly: boolean;
  ghosts: readonly PeerGhosts[];
  /** Set to this panel's propose action, so the P shortcut and the toolbar's Propose run it. */
  proposeRef: RefObject<() => void>;
}

const SCOPES: { value: ProposalScope; label: string }[] = [
  { value: 'unassigned', label: 'Unassigned atoms only' },
  { value: 'all', label: 'Whole molecule' },
];

/**
 * Propose, then accept or dismiss the proposed beads one by one or all at once. The open proposal is
 * the mapping's (kept in the draft): everyone who may edit decides its beads; viewers only see them.
 */
export function ProposalPanel({ session, mappingId, readOnly, ghosts, proposeRef }: ProposalPanelProps) {
  const [scope, setScope] = useState<ProposalScope>('unassigned');
  const [note, setNote] = useState<string | null>(null);
  // The last answer here: the best proposal and up to two alternatives, any of which can be put on
  // show while the proposal opened from it is still the open one (the alternatives are not stored).
  const [answer, setAnswer] = useState<{ id: string; scope: ProposalScope; proposals: Proposal[]; shown: number } | null>(null);
  const propose = useProposeMapping(mappingId);
  const legend = useId();
  const open = ghosts[0] ?? null;
  const own = open?.proposal ?? null;
  const me = () => {
    const s = session.getSnapshot().session;
    return s ? { id: s.userId, name: s.displayName, colour: presenceColour(s.userId) } : null;
  };

  const run = () => {
    if (readOnly || propose.isPending) return;
    setNote(null);
    propose.mutate(
      { scope },
      {
        onSuccess: ({ proposals }) => {
          const best = proposals[0];
          const by = me();
          if (!by) return;
          if (!best || best.beads.length === 0) {
            setNote(scope === 'unassigned' ? 'Every atom already has a bead: nothing to propose.' : 'Nothing to propose.');
            setAnswer(null);
            closeProposal(session.doc);
          } else {
            setAnswer({ id: openProposal(session.doc, best, scope, by), scope, proposals, shown: 0 });
          }
        },
      },
    );
  };
  useEffect(() => {
    proposeRef.current = run;
  });

  const show = (index: number) => {
    const by = me();
    if (!answer || !by || readOnly) return;
    setAnswer({ ...answer, id: openProposal(session.doc, answer.proposals[index], answer.scope, by), shown: index });
  };

  // Accepting is one transaction with the editor's origin: one undo step for whoever accepted (and the
  // undo brings the ghosts back). Dismissing is not an edit of the mapping, so not an undo step.
  const settle = (beads: readonly GhostBead[], accept: boolean) => {
    if (!own || readOnly) return;
    if (accept) acceptGhosts(session.doc, beads, session.origin);
    else dismissGhosts(session.doc, beads.map((b) => b.key));
  };

  return (
    <div className="flex flex-col gap-2 text-sm">
      {!readOnly && (
        <div className="flex flex-wrap items-end gap-3">
          <fieldset aria-labelledby={legend} className="flex flex-col gap-1">
            <span id={legend} className="font-semibold text-ink-800">Propose for</span>
            {SCOPES.map((s) => (
              <label key={s.value} className="flex items-center gap-2">
                <input type="radio" name={`proposal-scope-${legend}`} value={s.value} checked={scope === s.value} onChange={() => setScope(s.value)} />
                {s.label}
              </label>
            ))}
          </fieldset>
          <Button size="sm" onClick={run} pending={propose.isPending} pendingText="Proposing…" aria-keyshortcuts="P">
            Propose
          </Button>
        </div>
      )}
      {propose.isError && <p role="alert" className="text-alert-700">{propose.error.message}</p>}
      {note && <p role="status">{note}</p>}
      {open?.isLocal && !readOnly && answer?.id === open.id && answer.proposals.length > 1 && (
        <div role="group" aria-label="Which proposal" className="flex flex-wrap gap-1">
          {answer.proposals.map((p, i) => (
            <Button key={i} size="sm" variant={answer.shown === i ? 'primary' : 'ghost'} aria-pressed={answer.shown === i} onClick={() => show(i)}>
              {i === 0 ? 'Best' : `Alternative ${i}`} (cost {p.cost.toFixed(1)}, {p.beads.length} beads)
            </Button>
          ))}
        </div>
      )}
      {open && own && (
        <>
          <p role="status">{open.isLocal ? 'Your proposal' : `${open.user.name} proposes ${own.beads.length} bead${own.beads.length === 1 ? '' : 's'}`} (dashed outlines){readOnly ? '.' : ': anyone editing may accept or dismiss its beads.'}</p>
          <ul aria-label="Proposed beads" className="flex max-h-60 flex-col gap-1 overflow-auto">
            {own.beads.map((b) => (
              <li key={b.key} aria-label={`Proposed bead ${b.name}`} className="flex items-center gap-2 rounded border border-dashed border-ink-300 px-2 py-1">
                <span className="min-w-0 flex-1">
                  <span className="font-semibold">{b.name}</span> · {b.atoms.length} atom{b.atoms.length === 1 ? '' : 's'}
                  {b.type ? ` · ${b.type}` : ''}
                  <SharesNote bead={b} />
                  <span className="block truncate text-xs text-ink-600" title={b.reason}>{b.reason}</span>
                </span>
                {!readOnly && (
                  <>
                    <Button size="sm" variant="secondary" aria-label={`Accept ${b.name}`} onClick={() => settle([b], true)}>Accept</Button>
                    <Button size="sm" variant="ghost" aria-label={`Dismiss ${b.name}`} onClick={() => settle([b], false)}>Dismiss</Button>
                  </>
                )}
              </li>
            ))}
          </ul>
          {!readOnly && (
            <div className="flex gap-2">
              <Button size="sm" variant="secondary" onClick={() => settle(own.beads, true)}>Accept all</Button>
              <Button size="sm" variant="ghost" onClick={() => settle(own.beads, false)}>Dismiss all</Button>
            </div>
          )}
        </>
      )}
      {!own && !note && <p className="text-ink-700">Proposed beads show as dashed outlines for everyone here until accepted or dismissed.</p>}
    </div>
  );
}

/** For a ghost that shares atoms with other ghosts: how many, and its size counted by weight. */
function SharesNote({ bead }: { bead: GhostBead }) {
  const { shared, weighted } = ghostShares(bead);
  if (shared === 0) return null;
  return (
    <span className="block text-xs text-ink-700" data-shares={shared}>
      shares {shared} atom{shared === 1 ? '' : 's'} · weighted size {Number(weighted.toFixed(2))}
    </span>
  );
}
