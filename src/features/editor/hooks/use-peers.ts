import { useEffect, useState } from 'react';
import type { MappingSession } from '../collab/mapping-session';
import { readPeers, type Peer } from '../model/presence';

/** Everyone in the mapping (the local person first), live from the awareness protocol. */
export function usePeers(session: MappingSession, atomCount: number): Peer[] {
  const [peers, setPeers] = useState<Peer[]>([]);
  useEffect(() => {
    const awareness = session.provider.awareness;
    const update = () => setPeers(readPeers(awareness.getStates() as Map<number, Record<string, unknown>>, awareness.clientID, atomCount));
    update();
    awareness.on('change', update);
    return () => awareness.off('change', update);
  }, [session, atomCount]);
  return peers;
}
