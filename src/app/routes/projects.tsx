import { useState } from 'react';
import { useLocation, useNavigate } from 'react-router';
import { Notice } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { Section } from '../../components/ui/section';
import { CreateProjectForm } from '../../features/projects/components/create-project-form';
import { ProjectList } from '../../features/projects/components/project-list';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { paths } from '../../lib/paths';
import { useCanSite } from '../../lib/authorization';

export function ProjectsRoute() {
  useDocumentTitle('Projects');
  const canCreate = useCanSite('project:create');
  const navigate = useNavigate();
  const [creating, setCreating] = useState(false);
  // A one-time message from the page that sent us here (e.g. after choosing a password).
  const notice = (useLocation().state as { notice?: string } | null)?.notice;

  return (
    <>
      <PageHeader
        title="Projects"
        description="Each project holds one group's molecules, their mappings and the people who work on them."
        actions={
          canCreate &&
          !creating && <Button onClick={() => setCreating(true)}>New project</Button>
        }
      />
      {notice && <div className="mb-4"><Notice>{notice}</Notice></div>}
      {creating && (
        <Section title="New project" description="You become its supervisor and can add members next." className="mb-6">
          <CreateProjectForm onCreated={(project) => navigate(paths.project(project.id))} onCancel={() => setCreating(false)} />
        </Section>
      )}
      <ProjectList />
    </>
  );
}
