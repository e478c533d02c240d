import type { ReactNode } from 'react';
import { isApiError } from '../../lib/api-client';

/** What a failed request should say to a person. */
export function errorMessage(error: unknown): string {
  if (isApiError(error)) return error.message;
  if (error instanceof Error) return error.message;
  return 'Something went wrong. Please try again.';
}

/** A failure about a whole form or page, announced to screen readers. */
export function ErrorAlert({ error, children }: { error?: unknown; children?: ReactNode }) {
  if (!error && !children) return null;
  return (
    <div role="alert" className="rounded-md border border-alert-600/30 bg-alert-50 px-3 py-2 text-sm text-alert-700">
      {children ?? errorMessage(error)}
    </div>
  );
}

/** A quiet confirmation that something worked. */
export function Notice({ children }: { children: ReactNode }) {
  return (
    <div role="status" className="rounded-md border border-ok-600/30 bg-ok-50 px-3 py-2 text-sm text-ok-700">
      {children}
    </div>
  );
}
