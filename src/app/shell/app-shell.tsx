import { Outlet } from 'react-router';
import { ErrorAlert } from '../../components/ui/alert';
import { Loading } from '../../components/ui/loading';
import { CurrentUserContext, useMe } from '../../lib/auth';
import { isApiError } from '../../lib/api-client';
import { ShellHeader } from './shell-header';

/** Every signed-in page: the header above, the page below. The shell's loader has asked who is signed in. */
export function AppShell() {
  const me = useMe();

  // Only after the cache was cleared (sign-out, a lost session) on the way to the sign-in page.
  if (me.isPending || (me.isError && isApiError(me.error) && me.error.status === 401)) {
    return (
      <div className="mx-auto max-w-5xl px-4">
        <Loading label="Opening Beadloom…" />
      </div>
    );
  }
  if (me.isError) {
    return (
      <div className="mx-auto max-w-5xl px-4 py-10">
        <ErrorAlert error={me.error} />
      </div>
    );
  }

  return (
    <CurrentUserContext value={me.data}>
      <div className="flex min-h-screen flex-col">
        <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:rounded focus:bg-paper-50 focus:px-3 focus:py-2">
          Skip to content
        </a>
        <ShellHeader me={me.data} />
        <main id="main" className="mx-auto w-full max-w-5xl flex-1 px-4 py-8">
          <Outlet />
        </main>
      </div>
    </CurrentUserContext>
  );
}
