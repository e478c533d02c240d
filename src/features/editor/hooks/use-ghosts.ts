import { useEffect, useState } from 'react';
import type { MappingSession } from '../collab/mapping-session';
import { readGhosts, type PeerGhosts } from '../model/proposal-ghosts';
import { proposalOf } from '../../../shared/proposal-doc';

/** The mapping's open proposal as ghosts, live from the draft document. */
export function useGhosts(session: MappingSession, atomCount: number, userId: number | null): PeerGhosts[] {
  const [ghosts, setGhosts] = useState<PeerGhosts[]>([]);
  useEffect(() => {
    const map = proposalOf(session.doc);
    const update = () => setGhosts(readGhosts(session.doc, userId, atomCount));
    update();
    map.observe(update);
    return () => map.unobserve(update);
  }, [session, atomCount, userId]);
  return ghosts;
}
