import { useEffect, useState } from 'react';
import type { MappingSession } from '../collab/mapping-session';
import { readGhosts, type PeerGhosts } from '../model/proposal-ghosts';

/** Everyone's proposal ghosts, live from the awareness protocol. */
export function useGhosts(session: MappingSession, atomCount: number): PeerGhosts[] {
  const [ghosts, setGhosts] = useState<PeerGhosts[]>([]);
  useEffect(() => {
    const awareness = session.provider.awareness;
    const update = () => setGhosts(readGhosts(awareness.getStates() as Map<number, Record<string, unknown>>, awareness.clientID, atomCount));
    update();
    awareness.on('change', update);
    return () => awareness.off('change', update);
  }, [session, atomCount]);
  return ghosts;
}
