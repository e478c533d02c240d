import { useLoaderData } from 'react-router';
import { PageHeader } from '../../components/ui/page-header';
import { Section } from '../../components/ui/section';
import { TextLink } from '../../components/ui/text-link';
import { CreateMoleculeForm } from '../../features/molecules/components/create-molecule-form';
import { UploadMoleculesForm } from '../../features/molecules/components/upload-molecules-form';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { paths } from '../../lib/paths';
import type { newMoleculeLoader } from '../loaders/page-loaders';

export function NewMoleculeRoute() {
  const { projectId } = useLoaderData<typeof newMoleculeLoader>();
  useDocumentTitle('New molecule');
  return (
    <>
      <PageHeader eyebrow={<TextLink to={paths.project(projectId)}>Back to the project</TextLink>} title="New molecule" />
      <div className="flex flex-col gap-6">
        <Section title="From SMILES">
          <CreateMoleculeForm projectId={projectId} />
        </Section>
        <Section title="From a structure file" description="A molfile, or an SD file with several records.">
          <UploadMoleculesForm projectId={projectId} />
        </Section>
      </div>
    </>
  );
}
