import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, setCsrfToken } from '../../../lib/api-client';

export function logout(): Promise<void> {
  return api.post<void>('/api/auth/logout');
}

/** Signs out and forgets everything cached for this person, whatever the server said. */
export function useLogout({ onSettled }: { onSettled?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: logout,
    onSettled: () => {
      setCsrfToken(null);
      queryClient.clear();
      onSettled?.();
    },
  });
}
