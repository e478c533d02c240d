import { Outlet, useNavigation } from 'react-router';
import { Loading } from '../../components/ui/loading';

/** Every page, signed in or not: the page, and a thin bar across the top while the next one loads. */
export function RootLayout() {
  const loading = useNavigation().state !== 'idle';
  return (
    <>
      {loading && (
        <div role="progressbar" aria-label="Loading the page" className="fixed inset-x-0 top-0 z-50 h-1 animate-pulse bg-ink-600" />
      )}
      <Outlet />
    </>
  );
}

/** Shown on the very first load until the first page's code and data are in. */
export function FirstLoad() {
  return (
    <div className="mx-auto max-w-5xl px-4">
      <Loading label="Opening Beadloom…" />
    </div>
  );
}
