import { useCallback, useRef } from 'react';
import { useParams } from 'react-router';
import type { MappingSession } from '../../features/editor/collab/mapping-session';
import { ErrorAlert } from '../../components/ui/alert';
import { Loading } from '../../components/ui/loading';
import { TextLink } from '../../components/ui/text-link';
import { useBeadTypes } from '../../features/bead-types/api/get-bead-types';
import { LiveMapping } from '../../features/editor/components/live-mapping';
import { useMapping } from '../../features/mappings/api/get-mapping';
import { useMolecule } from '../../features/molecules/api/get-molecule';
import { useProject } from '../../features/projects/api/get-project';
import { useEditorThreads } from '../../features/threads/hooks/use-editor-threads';
import { VersionThreads } from '../../features/threads/components/version-threads';
import { MappingHistory } from '../../features/versions/components/mapping-history';
import { ExportMenu } from '../../features/exports/components/export-menu';
import { useCurrentUser } from '../shell/current-user';
import { can } from '../../shared/permissions';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { isApiError } from '../../lib/api-client';
import { paths } from '../../lib/paths';
import { NotFoundRoute } from './not-found';

export function MappingRoute() {
  const mappingId = Number(useParams().mappingId);
  return Number.isInteger(mappingId) && mappingId > 0 ? <MappingPage mappingId={mappingId} /> : <NotFoundRoute />;
}

function MappingPage({ mappingId }: { mappingId: number }) {
  const mapping = useMapping(mappingId);
  const molecule = useMolecule(mapping.data?.moleculeId ?? 0, mapping.isSuccess);
  const library = useBeadTypes(mapping.data?.projectId ?? 0, mapping.isSuccess);
  const project = useProject(mapping.data?.projectId ?? 0);
  // The open editor's session: a restore names its connection so the restore comes back undoable there.
  const session = useRef<MappingSession | null>(null);
  const onSession = useCallback((s: MappingSession | null) => void (session.current = s), []);
  const editor = useCallback(() => (session.current ? { clientId: session.current.clientId, beadCount: session.current.beadCount() } : null), []);
  useDocumentTitle(mapping.data && molecule.data ? `${mapping.data.name} · ${molecule.data.name}` : undefined);

  const failed = [mapping, molecule, library].find((q) => q.isError);
  if (failed) return isApiError(failed.error) && failed.error.status === 404 ? <NotFoundRoute /> : <ErrorAlert error={failed.error} />;
  if (!mapping.data || !molecule.data || !library.data) return <Loading label="Loading the mapping…" />;

  return (
    // The editor wants the whole window: it steps out of the shell's reading-width column.
    <div className="relative left-1/2 flex w-[calc(100vw-2rem)] max-w-[112rem] -translate-x-1/2 flex-col gap-3">
      <header className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <nav aria-label="Breadcrumb" className="text-sm text-ink-600">
          <TextLink to={paths.project(mapping.data.projectId)}>{project.data?.name ?? 'Project'}</TextLink>
          <span aria-hidden="true"> / </span>
          <TextLink to={paths.molecule(molecule.data.id)}>{molecule.data.name}</TextLink>
          <span aria-hidden="true"> / </span>
        </nav>
        <h1 className="text-2xl font-bold text-ink-900">{mapping.data.name}</h1>
        <span className="rounded-full bg-ink-100 px-2 py-0.5 text-xs font-semibold text-ink-800">{mapping.data.resolution} target</span>
        {mapping.data.locked && <span className="rounded-full bg-paper-200 px-2 py-0.5 text-xs font-semibold text-ink-800">Production version locked</span>}
      </header>
      <MappingWithThreads mapping={mapping.data} molecule={molecule.data.model} library={library.data.types} onSession={onSession} />
      <HistoryAndExports mapping={mapping.data} editor={editor} />
    </div>
  );
}

/** The editor with comment threads on its beads (badges, the panel beside the canvas, deep links). */
function MappingWithThreads(props: Parameters<typeof LiveMapping>[0]) {
  const me = useCurrentUser();
  const { projectId } = props.mapping;
  const role = me.projects.find((p) => p.projectId === projectId)?.role ?? null;
  const canModerate = can({ isAdmin: me.isAdmin, role }, 'comment:moderate');
  const threads = useEditorThreads({ mappingId: props.mapping.id, projectId, me: { id: me.id, canModerate } });
  return <LiveMapping {...props} threads={threads} />;
}

/** Versions, the production lock, the audit trail and exports, with the caller's rights in this project. */
function HistoryAndExports({ mapping, editor }: { mapping: NonNullable<ReturnType<typeof useMapping>['data']>; editor: () => { clientId: number; beadCount: number } | null }) {
  const me = useCurrentUser();
  const standing = { isAdmin: me.isAdmin, role: me.projects.find((p) => p.projectId === mapping.projectId)?.role ?? null };
  return (
    <MappingHistory
      mapping={mapping}
      canEdit={can(standing, 'version:save')}
      canLock={can(standing, 'mapping:lock')}
      exportMenu={(states, versions) => <ExportMenu mappingId={mapping.id} projectId={mapping.projectId} states={states} versions={versions} />}
      versionThreads={(n) => <VersionThreads mappingId={mapping.id} version={n} />}
      editor={editor}
    />
  );
}
