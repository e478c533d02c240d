import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorAlert } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/loading';
import { useProjects } from '../api/get-projects';
import { ProjectCard } from './project-card';

export function ProjectList() {
  const projects = useProjects();

  if (projects.isPending) return <Loading label="Loading projects…" />;
  if (projects.isError) return <ErrorAlert error={projects.error} />;
  if (projects.data.length === 0) {
    return (
      <EmptyState title="No projects yet">
        When a supervisor adds you to a project, it appears here.
      </EmptyState>
    );
  }
  return (
    <ul aria-label="Projects" className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
      {projects.data.map((project) => (
        <ProjectCard key={project.id} project={project} />
      ))}
    </ul>
  );
}
