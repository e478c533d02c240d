import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordBody } from '../../../shared/auth';
import { api } from '../../../lib/api-client';

/** Changes the password; the server ends this account's other sessions. */
export function changePassword(body: ChangePasswordBody): Promise<void> {
  return api.post<void>('/api/me/password', body);
}

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
