import { api } from '../../../lib/api-client';
import { useMappingHistoryMutation } from './save-version';

export const restoreVersion = (mappingId: number, n: number) => api.post<{ restored: number }>(`/api/mappings/${mappingId}/versions/${n}/restore`);

export function useRestoreVersion(mappingId: number) {
  return useMappingHistoryMutation(mappingId, (n: number) => restoreVersion(mappingId, n));
}
