import { useState } from 'react';
import { useLoaderData } from 'react-router';
import { useSuspenseQuery } from '@tanstack/react-query';
import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { Section } from '../../components/ui/section';
import { TextLink } from '../../components/ui/text-link';
import { projectQueryOptions } from '../../features/projects/api/get-project';
import { AddMemberForm } from '../../features/projects/components/add-member-form';
import { EditProjectForm } from '../../features/projects/components/edit-project-form';
import { MemberList } from '../../features/projects/components/member-list';
import { BeadTypeLibrary } from '../../features/bead-types/components/bead-type-library';
import { MoleculeList } from '../../features/molecules/components/molecule-list';
import { RoleBadge } from '../../features/projects/components/role-badge';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { paths } from '../../lib/paths';
import { useCurrentUser } from '../../lib/auth';
import { useCan } from '../../lib/authorization';
import type { projectLoader } from '../loaders/page-loaders';

export function ProjectRoute() {
  const { projectId } = useLoaderData<typeof projectLoader>();
  const me = useCurrentUser();
  const project = useSuspenseQuery(projectQueryOptions(projectId));
  const [editing, setEditing] = useState(false);
  useDocumentTitle(project.data.name);

  // The shared rule table decides, as on the server.
  const canManage = useCan('members:manage', projectId);
  const canAddMolecules = useCan('molecule:create', projectId);
  const canEditLibrary = useCan('library:edit', projectId);

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
          actions={canAddMolecules && <TextLink to={paths.newMolecule(projectId)}>New molecule</TextLink>}
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
        <BeadTypeLibrary projectId={projectId} canEdit={canEditLibrary} />
      </Section>
    </>
  );
}
