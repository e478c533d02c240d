import { createBrowserRouter, Navigate } from 'react-router';
import { setUnauthenticatedHandler } from '../lib/api-client';
import { paths } from '../lib/paths';
import { queryClient } from './provider';
import { AccountRoute } from './routes/account';
import { AdminUsersRoute } from './routes/admin-users';
import { MappingRoute } from './routes/mapping';
import { MoleculeRoute } from './routes/molecule';
import { NewMoleculeRoute } from './routes/new-molecule';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { NotFoundRoute } from './routes/not-found';
import { ProjectRoute } from './routes/project';
import { ProjectsRoute } from './routes/projects';
import { ResetPasswordRoute } from './routes/reset-password';
import { RouteError } from './routes/route-error';
import { SignInRoute } from './routes/sign-in';
import { AppShell } from './shell/app-shell';

const publicPaths: readonly string[] = [paths.signIn, paths.forgotPassword, paths.resetPassword];

export const router = createBrowserRouter([
  { path: paths.signIn, element: <SignInRoute />, errorElement: <RouteError /> },
  { path: paths.forgotPassword, element: <ForgotPasswordRoute />, errorElement: <RouteError /> },
  { path: paths.resetPassword, element: <ResetPasswordRoute />, errorElement: <RouteError /> },
  {
    element: <AppShell />,
    errorElement: <RouteError />,
    children: [
      { index: true, element: <Navigate to={paths.projects} replace /> },
      { path: paths.projects, element: <ProjectsRoute /> },
      { path: '/projects/:projectId', element: <ProjectRoute /> },
      { path: '/projects/:projectId/molecules/new', element: <NewMoleculeRoute /> },
      { path: '/molecules/:moleculeId', element: <MoleculeRoute /> },
      { path: '/mappings/:mappingId', element: <MappingRoute /> },
      { path: paths.adminUsers, element: <AdminUsersRoute /> },
      { path: paths.account, element: <AccountRoute /> },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
]);

// A lost session (401 `unauthenticated`) anywhere: forget the cache and ask to sign in,
// coming back to the same page afterwards.
setUnauthenticatedHandler(() => {
  const { pathname, search } = router.state.location;
  if (publicPaths.includes(pathname)) return;
  queryClient.clear();
  void router.navigate(`${paths.signIn}?next=${encodeURIComponent(pathname + search)}`, { replace: true });
});
