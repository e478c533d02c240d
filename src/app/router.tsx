import { createBrowserRouter, type RouteObject } from 'react-router';
import { setUnauthenticatedHandler } from '../lib/api-client';
import { paths, routePatterns } from '../lib/paths';
import { queryClient } from './provider';
import { mappingLoader } from './loaders/mapping-loader';
import * as load from './loaders/page-loaders';
import { onlyOnNewPath } from './loaders/route-data';
import { RouteError } from './routes/route-error';
import { FirstLoad, RootLayout } from './shell/root-layout';

// Router-first: every page's code is its own chunk (`lazy`), and its loader fills the query cache
// while that chunk downloads, so a page renders with its data instead of fetching after it mounts.
// A loader's 404 (bad id, unknown or invisible record, unknown path) goes to the one RouteError
// boundary; inside the shell it renders below the header.

const page = (route: Omit<RouteObject, 'index' | 'children'> & { path: string }): RouteObject => ({
  shouldRevalidate: onlyOnNewPath,
  ...route,
});

const publicPaths: readonly string[] = [paths.signIn, paths.forgotPassword, paths.resetPassword];

export const router = createBrowserRouter([
  {
    Component: RootLayout,
    HydrateFallback: FirstLoad,
    ErrorBoundary: RouteError,
    children: [
      page({ path: routePatterns.signIn, lazy: { Component: async () => (await import('./routes/sign-in')).SignInRoute } }),
      page({ path: routePatterns.forgotPassword, lazy: { Component: async () => (await import('./routes/forgot-password')).ForgotPasswordRoute } }),
      page({ path: routePatterns.resetPassword, lazy: { Component: async () => (await import('./routes/reset-password')).ResetPasswordRoute } }),
      {
        id: 'shell',
        loader: load.shellLoader,
        shouldRevalidate: onlyOnNewPath,
        lazy: { Component: async () => (await import('./shell/app-shell')).AppShell },
        children: [
          {
            // Errors of a page show inside the shell, below its header.
            ErrorBoundary: RouteError,
            children: [
              { index: true, loader: load.indexLoader },
              page({ path: routePatterns.projects, loader: load.projectsLoader, lazy: { Component: async () => (await import('./routes/projects')).ProjectsRoute } }),
              page({ path: routePatterns.project, loader: load.projectLoader, lazy: { Component: async () => (await import('./routes/project')).ProjectRoute } }),
              page({ path: routePatterns.newMolecule, loader: load.newMoleculeLoader, lazy: { Component: async () => (await import('./routes/new-molecule')).NewMoleculeRoute } }),
              page({ path: routePatterns.molecule, loader: load.moleculeLoader, lazy: { Component: async () => (await import('./routes/molecule')).MoleculeRoute } }),
              page({ path: routePatterns.mapping, loader: mappingLoader, lazy: { Component: async () => (await import('./routes/mapping')).MappingRoute } }),
              page({ path: routePatterns.adminUsers, loader: load.adminUsersLoader, lazy: { Component: async () => (await import('./routes/admin-users')).AdminUsersRoute } }),
              page({ path: routePatterns.account, loader: load.accountLoader, lazy: { Component: async () => (await import('./routes/account')).AccountRoute } }),
              page({ path: '*', loader: load.unknownPathLoader }),
            ],
          },
        ],
      },
    ],
  },
]);

// A lost session (401 `unauthenticated`) anywhere: forget the cache and ask to sign in, coming back
// to the same page afterwards. While a navigation loads, its loaders do this themselves (with the
// page being opened as the way back), so the handler leaves it to them.
setUnauthenticatedHandler(() => {
  const { location, navigation, initialized } = router.state;
  if (!initialized || navigation.state !== 'idle') return;
  if (publicPaths.includes(location.pathname)) return;
  queryClient.clear();
  void router.navigate(paths.signInThenBack(location.pathname + location.search), { replace: true });
});
