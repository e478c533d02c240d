import { useState } from 'react';
import { useLoaderData } from 'react-router';
import { useSuspenseQuery } from '@tanstack/react-query';
import { Button } from '../../components/ui/button';
import { ImportMappingDialog } from '../../features/molecules/components/import-mapping-dialog';
import { PageHeader } from '../../components/ui/page-header';
import { Section } from '../../components/ui/section';
import { TextLink } from '../../components/ui/text-link';
import { MappingList } from '../../features/mappings/components/mapping-list';
import { NewMappingForm } from '../../features/mappings/components/new-mapping-form';
import { moleculeQueryOptions } from '../../features/molecules/api/get-molecule';
import { MoleculeActions } from '../../features/molecules/components/molecule-actions';
import { MoleculeFacts } from '../../features/molecules/components/molecule-facts';
import { MoleculeThumbnail } from '../../features/molecules/components/molecule-thumbnail';
import { useProject } from '../../features/projects/api/get-project';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { ReferencesPanel } from '../../features/references/components/references-panel';
import { AnalysesPanel } from '../../features/references/components/analyses-panel';
import { useReferences } from '../../features/references/api/get-references';
import { useMappings } from '../../features/mappings/api/get-mappings';
import { paths } from '../../lib/paths';
import { useCan } from '../../lib/authorization';
import type { moleculeLoader } from '../loaders/page-loaders';

export function MoleculeRoute() {
  const { moleculeId } = useLoaderData<typeof moleculeLoader>();
  const m = useSuspenseQuery(moleculeQueryOptions(moleculeId)).data;
  const project = useProject(m.projectId);
  const [importing, setImporting] = useState(false);
  useDocumentTitle(m.name);
  // The shared rule table decides, as on the server (site admins included).
  const canEdit = useCan('molecule:update', m.projectId);
  const canMap = useCan('mapping:create', m.projectId);
  const references = useReferences(m.id);
  const mappings = useMappings(m.id);

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
              <NewMappingForm moleculeId={m.id} projectId={m.projectId} />
            </Section>
          )}
        </div>
      </div>
      {/* Stacked, so the analyses' charts have the page's width beside the picked term's beads. */}
      <div className="mt-6 flex flex-col gap-6">
        <Section title="References" description="Atomistic simulations of this molecule; Beadloom finds every copy in them.">
          <ReferencesPanel moleculeId={m.id} projectId={m.projectId} />
        </Section>
        <Section title="Analyses" description="A mapping version applied to a reference: bonded distributions and Boltzmann-inverted parameters.">
          {mappings.data && mappings.data.length > 0 ? (
            <AnalysesPanel projectId={m.projectId} molecule={m.model} mappings={mappings.data.map((p) => ({ id: p.id, name: p.name }))} references={references.data ?? []} />
          ) : (
            <p className="text-sm text-ink-600">Make a mapping first.</p>
          )}
        </Section>
      </div>
      {importing && <ImportMappingDialog molecule={m} onClose={() => setImporting(false)} />}
    </>
  );
}
