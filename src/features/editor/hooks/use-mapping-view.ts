import { useEffect, useState } from 'react';
import type * as Y from 'yjs';
import type { Bond } from '../../../shared/chem';
import { mappingView, type MappingView } from '../model/bead-view';
import { keepUnchanged } from '../model/stable-view';

/**
 * The bead view of the live document, recomputed after each transaction (local or remote). Beads a
 * transaction left alone keep their view objects, so only the changed ones redraw.
 */
export function useMappingView(doc: Y.Doc, bonds: readonly Bond[]): MappingView {
  const [view, setView] = useState(() => mappingView(doc, bonds));
  useEffect(() => {
    const update = () => {
      const next = mappingView(doc, bonds);
      setView((previous) => keepUnchanged(previous, next));
    };
    update();
    doc.on('afterTransaction', update);
    return () => doc.off('afterTransaction', update);
  }, [doc, bonds]);
  return view;
}
