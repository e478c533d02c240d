import { useMutation } from '@tanstack/react-query';
import type { ResetBody } from '../../../shared/auth';
import { api } from '../../../lib/api-client';

/** Sets a password from an e-mailed token (first-use invitation or reset). */
export function resetPassword(body: ResetBody): Promise<void> {
  return api.post<void>('/api/auth/reset', body);
}

export function useResetPassword() {
  return useMutation({ mutationFn: resetPassword });
}
