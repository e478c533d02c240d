import type { LockBody, LockState, UnlockBody } from '../../../shared/versions';
import { api } from '../../../lib/api-client';
import { useMappingHistoryMutation } from './save-version';

export const lockMapping = (mappingId: number, body: LockBody) => api.post<LockState>(`/api/mappings/${mappingId}/lock`, body);
export const unlockMapping = (mappingId: number, body: UnlockBody) => api.post<LockState>(`/api/mappings/${mappingId}/unlock`, body);

export function useLockMapping(mappingId: number) {
  return useMappingHistoryMutation(mappingId, (body: LockBody) => lockMapping(mappingId, body));
}

export function useUnlockMapping(mappingId: number) {
  return useMappingHistoryMutation(mappingId, (body: UnlockBody) => unlockMapping(mappingId, body));
}
