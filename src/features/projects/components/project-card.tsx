import { Link } from 'react-router';
import type { ProjectSummary } from '../../../shared/projects';
import { formatDate, plural } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { RoleBadge } from './role-badge';

export function ProjectCard({ project }: { project: ProjectSummary }) {
  return (
    <li>
      <Link
        to={paths.project(project.id)}
        className="group flex h-full flex-col rounded-lg border border-paper-300 bg-paper-50 p-5 shadow-card transition-colors hover:border-ink-300"
      >
        <div className="flex items-start justify-between gap-3">
          <h2 className="text-lg font-bold text-ink-900 group-hover:text-ink-700">{project.name}</h2>
          <RoleBadge role={project.role} />
        </div>
        <p className="mt-2 line-clamp-3 flex-1 text-sm text-ink-700">
          {project.description || <span className="italic text-ink-500">No description yet.</span>}
        </p>
        <p className="mt-4 text-xs text-ink-600">
          {plural(project.moleculeCount, 'molecule')} · {plural(project.memberCount, 'member')} · since{' '}
          {formatDate(project.createdAt)}
        </p>
      </Link>
    </li>
  );
}
