import { useEffect, useState } from 'react';
import type * as Y from 'yjs';
import type { Bond } from '../../../shared/chem';
import { mappingView, type MappingView } from '../model/bead-view';

/** The bead view of the live document, recomputed after each transaction (local or remote). */
export function useMappingView(doc: Y.Doc, bonds: readonly Bond[]): MappingView {
  const [view, setView] = useState(() => mappingView(doc, bonds));
  useEffect(() => {
    setView(mappingView(doc, bonds));
    const update = () => setView(mappingView(doc, bonds));
    doc.on('afterTransaction', update);
    return () => doc.off('afterTransaction', update);
  }, [doc, bonds]);
  return view;
}
