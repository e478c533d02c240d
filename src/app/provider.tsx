import { QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { createQueryClient } from '../lib/query-client';

/** One cache for the whole tab; the router's sign-out path clears it. */
export const queryClient = createQueryClient();

export function AppProvider({ children }: { children: ReactNode }) {
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
