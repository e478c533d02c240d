import { data, redirect, type ShouldRevalidateFunction } from 'react-router';
import { isApiError } from '../../lib/api-client';
import { paths } from '../../lib/paths';
import { queryClient } from '../provider';

// Loaders fill the TanStack Query cache (the page's hooks then find their data there) and turn the
// server's refusals into route outcomes, so no page handles them by hand:
//   404 (unknown id, or a project the caller is not a member of) → the route error boundary's "Nothing here";
//   401 unauthenticated (the session is gone) → sign-in, coming back here afterwards.

/** Throws the 404 the route error boundary shows as "Nothing here". */
export function notFound(): never {
  throw data(null, { status: 404, statusText: 'Not Found' });
}

/** A route's numeric id parameter; anything but a positive integer is a page that does not exist. */
export function idParam(value: string | undefined): number {
  const id = Number(value);
  if (!Number.isInteger(id) || id <= 0) notFound();
  return id;
}

/** Runs a loader's cache fills and maps the server's 404 and lost session to the route outcomes above. */
export async function fill(request: Request, work: () => Promise<unknown>): Promise<void> {
  try {
    await work();
  } catch (error) {
    if (isApiError(error) && error.status === 404) notFound();
    if (isApiError(error) && error.status === 401 && error.code === 'unauthenticated') {
      queryClient.clear();
      const url = new URL(request.url);
      throw redirect(paths.signInThenBack(url.pathname + url.search));
    }
    throw error;
  }
}

/**
 * The cache keeps itself fresh (stale times, invalidations, live events), so a loader need not run
 * again when only the search changes (the editor keeps its open thread in `?bead=&thread=`).
 */
export const onlyOnNewPath: ShouldRevalidateFunction = ({ currentUrl, nextUrl, defaultShouldRevalidate }) =>
  currentUrl.pathname !== nextUrl.pathname && defaultShouldRevalidate;
