import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LoginBody, LoginResponse } from '../../../shared/auth';
import { api, setCsrfToken } from '../../../lib/api-client';

export function login(body: LoginBody): Promise<LoginResponse> {
  return api.post<LoginResponse>('/api/auth/login', body);
}

/** Signs in; the session (and so the CSRF token) is new, and nothing cached belongs to it. */
export function useLogin({ onSuccess }: { onSuccess?: (response: LoginResponse) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: (response) => {
      setCsrfToken(response.csrfToken);
      queryClient.clear();
      onSuccess?.(response);
    },
  });
}
