import { useCallback, useMemo, useRef } from 'react';
import { useLoaderData, useSearchParams } from 'react-router';
import { useSuspenseQuery } from '@tanstack/react-query';
import type { MappingDetail } from '../../shared/mappings';
import type { MappingSession } from '../../features/editor/collab/mapping-session';
import { TextLink } from '../../components/ui/text-link';
import { beadTypesQueryOptions } from '../../features/bead-types/api/get-bead-types';
import { LiveMapping } from '../../features/editor/components/live-mapping';
import { mappingQueryOptions } from '../../features/mappings/api/get-mapping';
import { moleculeQueryOptions } from '../../features/molecules/api/get-molecule';
import { useProject } from '../../features/projects/api/get-project';
import { useEditorThreads } from '../../features/threads/components/use-editor-threads';
import { VersionThreads } from '../../features/threads/components/version-threads';
import { TransferReportPanel } from '../../features/mappings/components/transfer-report';
import { MappingHistory } from '../../features/versions/components/mapping-history';
import { ExportMenu } from '../../features/exports/components/export-menu';
import { useCurrentUser } from '../../lib/auth';
import { useCan } from '../../lib/authorization';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { paths } from '../../lib/paths';
import type { mappingLoader } from '../loaders/mapping-loader';

export function MappingRoute() {
  const { mappingId } = useLoaderData<typeof mappingLoader>();
  // The loader has filled these; a later failed refresh keeps what was read.
  const mapping = useSuspenseQuery(mappingQueryOptions(mappingId)).data;
  const molecule = useSuspenseQuery(moleculeQueryOptions(mapping.moleculeId)).data;
  const library = useSuspenseQuery(beadTypesQueryOptions(mapping.projectId)).data;
  const project = useProject(mapping.projectId);
  // The open editor's session: a restore names its connection so the restore comes back undoable there.
  const session = useRef<MappingSession | null>(null);
  const onSession = useCallback((s: MappingSession | null) => void (session.current = s), []);
  const editor = useCallback(() => (session.current ? { clientId: session.current.clientId, beadCount: session.current.beadCount() } : null), []);
  useDocumentTitle(`${mapping.name} · ${molecule.name}`);
  // `?beads=` from an analysis term: those beads are shown marked in the editor.
  const [search] = useSearchParams();
  const linkedBeads = useMemo(() => search.get('beads')?.split(',').filter(Boolean).slice(0, 4), [search]);

  return (
    // The editor wants the whole window: it steps out of the shell's reading-width column.
    <div className="relative left-1/2 flex w-[calc(100vw-2rem)] max-w-[112rem] -translate-x-1/2 flex-col gap-3">
      <header className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <nav aria-label="Breadcrumb" className="text-sm text-ink-600">
          <TextLink to={paths.project(mapping.projectId)}>{project.data?.name ?? 'Project'}</TextLink>
          <span aria-hidden="true"> / </span>
          <TextLink to={paths.molecule(molecule.id)}>{molecule.name}</TextLink>
          <span aria-hidden="true"> / </span>
        </nav>
        <h1 className="text-2xl font-bold text-ink-900">{mapping.name}</h1>
        <span className="rounded-full bg-ink-100 px-2 py-0.5 text-xs font-semibold text-ink-800">{mapping.resolution} target</span>
        {mapping.locked && <span className="rounded-full bg-paper-200 px-2 py-0.5 text-xs font-semibold text-ink-800">Production version locked</span>}
      </header>
      <TransferReportPanel atomCount={molecule.model.heavyAtoms ?? molecule.model.atoms.length} />
      <MappingWithThreads mapping={mapping} molecule={molecule.model} library={library.types} onSession={onSession} linkedBeads={linkedBeads} />
      <HistoryAndExports mapping={mapping} editor={editor} />
    </div>
  );
}

/** The editor with comment threads on its beads (badges, the panel beside the canvas, deep links). */
function MappingWithThreads(props: Parameters<typeof LiveMapping>[0]) {
  const me = useCurrentUser();
  const { projectId } = props.mapping;
  const canModerate = useCan('comment:moderate', projectId);
  const threads = useEditorThreads({ mappingId: props.mapping.id, projectId, me: { id: me.id, canModerate } });
  return <LiveMapping {...props} threads={threads} />;
}

/** Versions, the production lock, the audit trail and exports, with the caller's rights in this project. */
function HistoryAndExports({ mapping, editor }: { mapping: MappingDetail; editor: () => { clientId: number; beadCount: number } | null }) {
  const canSave = useCan('version:save', mapping.projectId);
  const canLock = useCan('mapping:lock', mapping.projectId);
  return (
    <MappingHistory
      mapping={mapping}
      canEdit={canSave}
      canLock={canLock}
      exportMenu={(states, versions) => <ExportMenu mappingId={mapping.id} projectId={mapping.projectId} states={states} versions={versions} />}
      versionThreads={(n) => <VersionThreads mappingId={mapping.id} version={n} />}
      editor={editor}
    />
  );
}
