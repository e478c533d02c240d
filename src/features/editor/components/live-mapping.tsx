import { useEffect } from 'react';
import type { BeadTypeRow } from '../../../shared/bead-types';
import type { Molecule } from '../../../shared/chem';
import type { MappingDetail } from '../../../shared/mappings';
import { useMappingSession, useSessionSnapshot } from '../hooks/use-mapping-session';
import type { MappingSession } from '../collab/mapping-session';
import { MappingEditor } from './mapping-editor';
import type { EditorThreads } from './thread-badges';

interface LiveMappingProps {
  mapping: MappingDetail;
  molecule: Molecule;
  library: readonly BeadTypeRow[];
  /** Comment threads on beads (badges, panel, deep link), when the page has them. */
  threads?: EditorThreads;
  /** Beads a link asks to show (`?beads=`). */
  linkedBeads?: readonly string[];
  /** Told of the live session when it opens (and null when it closes), e.g. so a restore can name it. */
  onSession?: (session: MappingSession | null) => void;
}

/** Opens the live draft of a mapping and shows the editor on it. */
export function LiveMapping({ onSession, ...props }: LiveMappingProps) {
  const { session, reload } = useMappingSession(props.mapping.id);
  useEffect(() => {
    onSession?.(session);
    return () => onSession?.(null);
  }, [session, onSession]);
  if (!session) return <p className="text-sm text-ink-600">Opening the live draft…</p>;
  return <ReloadOnRefusal session={session} reload={reload} {...props} />;
}

function ReloadOnRefusal({ session, reload, ...props }: LiveMappingProps & { session: MappingSession; reload(): void }) {
  const { refusals, refused } = useSessionSnapshot(session);
  useEffect(() => {
    // The server refused one of our updates and kept its document: start over from it.
    if (refusals > 0) {
      console.warn(`Beadloom: an edit was refused (${refused?.message ?? 'no reason given'}); reloading the draft.`);
      reload();
    }
  }, [refusals, refused, reload]);
  return <MappingEditor session={session} {...props} />;
}
