import { QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';

// Answers the server gave on purpose (404, 403, validation) are not worth
// retrying; only network trouble and 5xx are.
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (failureCount >= 2) return false;
  if (isApiError(error)) return error.status === 0 || error.status >= 500;
  return true;
}

export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { staleTime: 30_000, retry: shouldRetry, refetchOnWindowFocus: false },
      mutations: { retry: false },
    },
  });
}
