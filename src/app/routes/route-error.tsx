import { isRouteErrorResponse, useRouteError } from 'react-router';
import { ErrorAlert } from '../../components/ui/alert';
import { Logo } from '../../components/ui/logo';
import { isApiError } from '../../lib/api-client';
import { NotFoundPage } from './not-found';

/**
 * The one route error boundary. A 404 from a loader (unknown path or id, a record that is gone or
 * belongs to a project the caller is not in) or from a page's own read shows "Nothing here";
 * anything else is a page that broke.
 */
export function RouteError() {
  const error = useRouteError();
  const missing = (isRouteErrorResponse(error) || isApiError(error)) && error.status === 404;
  if (missing) return <NotFoundPage />;
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : undefined;
  return (
    <div className="mx-auto max-w-lg px-4 py-16">
      <Logo />
      <h1 className="mt-8 text-2xl font-bold text-ink-950">Something broke on this page</h1>
      <div className="mt-4">
        <ErrorAlert error={message ? undefined : error}>{message}</ErrorAlert>
      </div>
      <p className="mt-6 text-sm">
        <a href="/" className="font-semibold text-ink-700 underline">Reload Beadloom</a>
      </p>
    </div>
  );
}
