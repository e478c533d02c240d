import { redirect, type LoaderFunctionArgs } from 'react-router';
import { meQueryOptions } from '../../lib/auth';
import { siteStanding } from '../../lib/authorization';
import { canSite } from '../../shared/permissions';
import { paths } from '../../lib/paths';
import { preferencesQueryOptions } from '../../features/notifications/api/get-preferences';
import { projectsQueryOptions } from '../../features/projects/api/get-projects';
import { projectQueryOptions } from '../../features/projects/api/get-project';
import { membersQueryOptions } from '../../features/projects/api/get-members';
import { moleculesQueryOptions } from '../../features/molecules/api/get-molecules';
import { moleculeQueryOptions } from '../../features/molecules/api/get-molecule';
import { mappingsQueryOptions } from '../../features/mappings/api/get-mappings';
import { beadTypesQueryOptions } from '../../features/bead-types/api/get-bead-types';
import { usersQueryOptions } from '../../features/users/api/get-users';
import { queryClient } from '../provider';
import { fill, idParam, notFound } from './route-data';

// The loaders of the signed-in pages other than the editor (mapping-loader.ts). Each awaits the
// reads its page cannot show without and whose 404 means "Nothing here" (ensureQueryData), and
// starts the rest at the same time (prefetchQuery never throws; a failed read shows in its section).

export const shellLoader = ({ request }: LoaderFunctionArgs) => fill(request, () => queryClient.ensureQueryData(meQueryOptions())).then(() => null);

export const indexLoader = () => redirect(paths.projects);

export const unknownPathLoader = () => notFound();

export const projectsLoader = ({ request }: LoaderFunctionArgs) => fill(request, () => queryClient.prefetchQuery(projectsQueryOptions())).then(() => null);

export async function projectLoader({ request, params }: LoaderFunctionArgs) {
  const projectId = idParam(params.projectId);
  await fill(request, () =>
    Promise.all([
      queryClient.ensureQueryData(projectQueryOptions(projectId)),
      queryClient.prefetchQuery(membersQueryOptions(projectId)),
      queryClient.prefetchQuery(moleculesQueryOptions(projectId)),
      queryClient.prefetchQuery(beadTypesQueryOptions(projectId)),
    ]),
  );
  return { projectId };
}

/** The forms need nothing loaded, but someone outside the project gets the same 404 as its page. */
export async function newMoleculeLoader({ request, params }: LoaderFunctionArgs) {
  const projectId = idParam(params.projectId);
  await fill(request, () => queryClient.ensureQueryData(projectQueryOptions(projectId)));
  return { projectId };
}

export async function moleculeLoader({ request, params }: LoaderFunctionArgs) {
  const moleculeId = idParam(params.moleculeId);
  await fill(request, async () => {
    const mappings = queryClient.prefetchQuery(mappingsQueryOptions(moleculeId));
    const molecule = await queryClient.ensureQueryData(moleculeQueryOptions(moleculeId));
    await Promise.all([mappings, queryClient.prefetchQuery(projectQueryOptions(molecule.projectId))]);
  });
  return { moleculeId };
}

export async function adminUsersLoader({ request }: LoaderFunctionArgs) {
  await fill(request, async () => {
    const me = await queryClient.ensureQueryData(meQueryOptions());
    if (!canSite(siteStanding(me), 'users:manage')) notFound();
    await queryClient.prefetchQuery(usersQueryOptions());
  });
  return null;
}

export const accountLoader = ({ request }: LoaderFunctionArgs) => fill(request, () => queryClient.prefetchQuery(preferencesQueryOptions())).then(() => null);
