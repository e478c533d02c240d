import type * as Y from 'yjs';
import type { Topology } from '../../../shared/chem';
import type { BondedParams } from '../../../shared/bonded-terms';
import { setBonded } from '../../../shared/mapping-doc';
import { Button } from '../../../components/ui/button';
import { isRigid, rigidRingEntries } from '../model/rigid-ring';

interface RingControlsProps {
  doc: Y.Doc;
  origin: unknown;
  readOnly: boolean;
  topology: Topology;
  stored: Readonly<Record<string, BondedParams>>;
  beadName(id: string): string;
}

/** One button per ring of beads: make it rigid (constraints, redundant terms left out) or flexible again, in one edit. */
export function RingControls({ doc, origin, readOnly, topology, stored, beadName }: RingControlsProps) {
  if (topology.rings.length === 0) return null;
  return (
    <ul className="flex flex-col gap-1 text-xs" aria-label="Rings of beads">
      {topology.rings.map((ring) => {
        const name = `ring ${ring.map(beadName).join('–')}`;
        const rigid = isRigid(ring, stored);
        return (
          <li key={ring.join(',')} className="flex items-center gap-2">
            <span className="font-semibold text-ink-800">{name}</span>
            <span className="text-ink-700">{rigid ? 'rigid: bonds are constraints, angles and dihedrals inside it left out' : 'flexible'}</span>
            {!readOnly && (
              <Button size="sm" variant="secondary" aria-label={rigid ? `Make ${name} flexible` : `Make ${name} rigid`} onClick={() => setBonded(doc, rigidRingEntries(topology, ring, stored, !rigid), undefined, origin)}>
                {rigid ? 'Make flexible' : 'Make ring rigid'}
              </Button>
            )}
          </li>
        );
      })}
    </ul>
  );
}
