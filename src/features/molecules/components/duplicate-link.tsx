import { Link } from 'react-router';
import { paths } from '../../../lib/paths';
import type { DuplicateMoleculeDetails } from '../../../shared/molecules';

/** The details of a `duplicate_molecule` answer, when that is what it is. */
export function duplicateOf(code: string | undefined, details: unknown): DuplicateMoleculeDetails | null {
  const d = details as Partial<DuplicateMoleculeDetails> | undefined;
  return code === 'duplicate_molecule' && d?.existing && typeof d.existing.id === 'number' ? (d as DuplicateMoleculeDetails) : null;
}

/** "This project already has it: <link>" — the molecule with the same structure. */
export function DuplicateLink({ duplicate }: { duplicate: DuplicateMoleculeDetails }) {
  return (
    <>
      This project already has this structure as{' '}
      <Link className="font-semibold underline" to={paths.molecule(duplicate.existing.id)}>{duplicate.existing.name}</Link>
      {duplicate.existing.archived ? ' (archived)' : ''}.
    </>
  );
}
