import { useState } from 'react';
import { useParams } from 'react-router';
import { ErrorAlert } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { Section } from '../../components/ui/section';
import { TextLink } from '../../components/ui/text-link';
import { useProject } from '../../features/projects/api/get-project';
import { AddMemberForm } from '../../features/projects/components/add-member-form';
import { EditProjectForm } from '../../features/projects/components/edit-project-form';
import { MemberList } from '../../features/projects/components/member-list';
import { BeadTypeLibrary } from '../../features/bead-types/components/bead-type-library';
import { MoleculeList } from '../../features/molecules/components/molecule-list';
import { RoleBadge } from '../../features/projects/components/role-badge';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { isApiError } from '../../lib/api-client';
import { paths } from '../../lib/paths';
import { useCurrentUser } from '../shell/current-user';
import { can } from '../../shared/permissions';
import { NotFoundRoute } from './not-found';

export function ProjectRoute() {
  const projectId = Number(useParams().projectId);
  const valid = Number.isInteger(projectId) && projectId > 0;
  return valid ? <ProjectPage projectId={projectId} /> : <NotFoundRoute />;
}

function ProjectPage({ projectId }: { projectId: number }) {
  const me = useCurrentUser();
  const project = useProject(projectId);
  const [editing, setEditing] = useState(false);
  useDocumentTitle(project.data?.name);

  if (project.isPending) return <Loading label="Loading project…" />;
  if (project.isError) {
    if (isApiError(project.error) && project.error.status === 404) return <NotFoundRoute />;
    return <ErrorAlert error={project.error} />;
  }

  // The shared rule table decides, as on the server.
  const standing = { isAdmin: me.isAdmin, role: project.data.role };
  const canManage = can(standing, 'members:manage');
  const canModel = can(standing, 'molecule:create');

  return (
    <>
      <PageHeader
        eyebrow={<TextLink to={paths.projects}>Projects</TextLink>}
        title={project.data.name}
        description={
          <div className="flex flex-col items-start gap-2">
            <RoleBadge role={project.data.role} />
            {!editing && <p className="whitespace-pre-line">{project.data.description || 'No description yet.'}</p>}
          </div>
        }
        actions={canManage && !editing && <Button variant="secondary" onClick={() => setEditing(true)}>Edit details</Button>}
      />
      {editing && (
        <Section title="Project details" className="mb-6">
          <EditProjectForm project={project.data} onDone={() => setEditing(false)} />
        </Section>
      )}
      <div className="grid items-start gap-6 lg:grid-cols-2">
        <Section
          title="Molecules"
          description="Structures this group maps to beads."
          actions={canModel && <TextLink to={paths.newMolecule(projectId)}>New molecule</TextLink>}
        >
          <MoleculeList projectId={projectId} />
        </Section>
        <div className="flex flex-col gap-6">
          <Section title="Members" description={canManage ? 'Change roles or remove people.' : undefined}>
            <MemberList projectId={projectId} currentUserId={me.id} canManage={canManage} />
          </Section>
          {canManage && (
            <Section title="Add a member" description="Someone new to Beadloom gets an invitation by e-mail.">
              <AddMemberForm projectId={projectId} />
            </Section>
          )}
        </div>
      </div>
      <Section title="Bead type library" className="mt-6" description="The types bead suggestions are drawn from (ΔG_OW in kJ/mol, positive prefers octanol).">
        <BeadTypeLibrary projectId={projectId} canEdit={canModel} />
      </Section>
    </>
  );
}
