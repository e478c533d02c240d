import { useEffect, useState, useSyncExternalStore } from 'react';
import { MappingSession, type SessionSnapshot } from '../collab/mapping-session';

/**
 * The live session of one mapping for as long as the editor is open; null until it exists.
 * `reload` starts over from the server's document (after the server refused one of our updates,
 * its document is unchanged but ours is not).
 */
export function useMappingSession(mappingId: number): { session: MappingSession | null; reload: () => void } {
  const [generation, setGeneration] = useState(0);
  const [session, setSession] = useState<MappingSession | null>(null);
  useEffect(() => {
    const fresh = new MappingSession(mappingId);
    setSession(fresh);
    return () => {
      fresh.destroy();
      setSession(null);
    };
  }, [mappingId, generation]);
  return { session, reload: () => setGeneration((g) => g + 1) };
}

export function useSessionSnapshot(session: MappingSession): SessionSnapshot {
  return useSyncExternalStore(session.subscribe, session.getSnapshot);
}
