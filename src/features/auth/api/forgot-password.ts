import { useMutation } from '@tanstack/react-query';
import type { ForgotBody } from '../../../shared/auth';
import { api } from '../../../lib/api-client';

/** Always answers 202, known address or not, so it reveals nothing. */
export function requestPasswordReset(body: ForgotBody): Promise<void> {
  return api.post<void>('/api/auth/forgot', body);
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
