import { useState } from 'react';
import { useParams } from 'react-router';
import { Button } from '../../components/ui/button';
import { ImportMappingDialog } from '../../features/molecules/components/import-mapping-dialog';
import { ErrorAlert } from '../../components/ui/alert';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { Section } from '../../components/ui/section';
import { TextLink } from '../../components/ui/text-link';
import { MappingList } from '../../features/mappings/components/mapping-list';
import { NewMappingForm } from '../../features/mappings/components/new-mapping-form';
import { useMolecule } from '../../features/molecules/api/get-molecule';
import { MoleculeActions } from '../../features/molecules/components/molecule-actions';
import { MoleculeFacts } from '../../features/molecules/components/molecule-facts';
import { MoleculeThumbnail } from '../../features/molecules/components/molecule-thumbnail';
import { useProject } from '../../features/projects/api/get-project';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { isApiError } from '../../lib/api-client';
import { paths } from '../../lib/paths';
import { can } from '../../shared/permissions';
import { useCurrentUser } from '../shell/current-user';
import { NotFoundRoute } from './not-found';

export function MoleculeRoute() {
  const moleculeId = Number(useParams().moleculeId);
  return Number.isInteger(moleculeId) && moleculeId > 0 ? <MoleculePage moleculeId={moleculeId} /> : <NotFoundRoute />;
}

function MoleculePage({ moleculeId }: { moleculeId: number }) {
  const me = useCurrentUser();
  const molecule = useMolecule(moleculeId);
  const project = useProject(molecule.data?.projectId ?? 0);
  const [importing, setImporting] = useState(false);
  useDocumentTitle(molecule.data?.name);
  if (molecule.isPending) return <Loading label="Loading molecule…" />;
  if (molecule.isError) return isApiError(molecule.error) && molecule.error.status === 404 ? <NotFoundRoute /> : <ErrorAlert error={molecule.error} />;
  const m = molecule.data;
  // The shared rule table decides, as on the server (site admins included).
  const standing = { isAdmin: me.isAdmin, role: project.data?.role ?? null };
  const canEdit = can(standing, 'molecule:update');
  const canMap = can(standing, 'mapping:create');

  return (
    <>
      <PageHeader
        eyebrow={<TextLink to={paths.project(m.projectId)}>{project.data?.name ?? 'Project'}</TextLink>}
        title={m.name}
        description={m.notes || undefined}
        actions={canEdit && <MoleculeActions molecule={m} />}
      />
      <div className="grid items-start gap-6 lg:grid-cols-[3fr_2fr]">
        <Section title="Structure">
          <div className="flex flex-wrap items-start gap-6">
            <MoleculeThumbnail sketch={m.sketch} label={m.name} size={240} />
            <div className="min-w-0 flex-1"><MoleculeFacts molecule={m} /></div>
          </div>
          {m.tags.length > 0 && (
            <ul aria-label="Tags" className="mt-4 flex flex-wrap gap-1.5">
              {m.tags.map((t) => <li key={t} className="rounded-full bg-paper-200 px-2 py-0.5 text-xs font-semibold text-ink-700">{t}</li>)}
            </ul>
          )}
        </Section>
        <div className="flex flex-col gap-6">
          <Section
            title="Mappings"
            description="Ways of grouping this molecule's atoms into beads."
            actions={canMap && <Button size="sm" variant="secondary" onClick={() => setImporting(true)}>Import a mapping…</Button>}
          >
            <MappingList moleculeId={m.id} />
          </Section>
          {canMap && (
            <Section title="New mapping">
              <NewMappingForm moleculeId={m.id} />
            </Section>
          )}
        </div>
      </div>
      {importing && <ImportMappingDialog molecule={m} onClose={() => setImporting(false)} />}
    </>
  );
}
