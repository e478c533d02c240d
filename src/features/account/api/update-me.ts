import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Me, UpdateMeBody } from '../../../shared/auth';
import { api } from '../../../lib/api-client';
import { meQueryOptions } from '../../../lib/auth';

export function updateMe(body: UpdateMeBody): Promise<Me> {
  return api.patch<Me>('/api/me', body);
}

export function useUpdateMe() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMe,
    onSuccess: (me) => queryClient.setQueryData(meQueryOptions().queryKey, me),
  });
}
