import { useState } from 'react';
import { useNavigate } from 'react-router';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { paths } from '../../../lib/paths';
import type { MoleculeSummary } from '../../../shared/molecules';
import { useDeleteMolecule, useUpdateMolecule } from '../api/update-molecule';

/**
 * Archive or delete. The server deletes a molecule only while no mapping of it has a version;
 * otherwise it archives it instead and says so.
 */
export function MoleculeActions({ molecule }: { molecule: MoleculeSummary }) {
  const update = useUpdateMolecule(molecule.projectId, molecule.id);
  const remove = useDeleteMolecule(molecule.projectId, molecule.id);
  const navigate = useNavigate();
  const [confirming, setConfirming] = useState(false);

  return (
    <div className="flex flex-col items-end gap-2">
      <div className="flex gap-2">
        <Button variant="secondary" size="sm" pending={update.isPending} onClick={() => update.mutate({ archived: !molecule.archived })}>
          {molecule.archived ? 'Restore from archive' : 'Archive'}
        </Button>
        {!confirming ? (
          <Button variant="danger" size="sm" onClick={() => setConfirming(true)}>Delete…</Button>
        ) : (
          <>
            <Button variant="danger" size="sm" pending={remove.isPending} onClick={() => remove.mutate(undefined, { onSuccess: (r) => !r && navigate(paths.project(molecule.projectId)) })}>
              Delete {molecule.name}
            </Button>
            <Button variant="ghost" size="sm" autoFocus onClick={() => setConfirming(false)}>Keep</Button>
          </>
        )}
      </div>
      {remove.data && <Notice>A mapping of this molecule has versions, so it was archived instead of deleted.</Notice>}
      {(update.isError || remove.isError) && <ErrorAlert error={update.error ?? remove.error} />}
    </div>
  );
}
