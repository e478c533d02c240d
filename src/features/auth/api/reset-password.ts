import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LoginResponse, ResetBody } from '../../../shared/auth';
import { api, setCsrfToken } from '../../../lib/api-client';

/**
 * Sets a password from an e-mailed token (first-use invitation or reset). The server signs the
 * person in with it (LoginResponse); nothing (204) when the account is disabled.
 */
export function resetPassword(body: ResetBody): Promise<LoginResponse | undefined> {
  return api.post<LoginResponse | undefined>('/api/auth/reset', body);
}

export function useResetPassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resetPassword,
    onSuccess: (response) => {
      if (!response) return;
      // A new session: a new CSRF token, and nothing cached belongs to it.
      setCsrfToken(response.csrfToken);
      queryClient.clear();
    },
  });
}
