import type { RestoreBody, RestoreResponse } from '../../../shared/versions';
import { api } from '../../../lib/api-client';
import { useMappingHistoryMutation } from './save-version';

export const restoreVersion = (mappingId: number, n: number, body: RestoreBody) => api.post<RestoreResponse>(`/api/mappings/${mappingId}/versions/${n}/restore`, body);

/** `clientId()` names the open editor's connection, which then gets the restore as a step it can undo. */
export function useRestoreVersion(mappingId: number, clientId?: () => number | undefined) {
  return useMappingHistoryMutation(mappingId, (n: number) => restoreVersion(mappingId, n, { clientId: clientId?.() }));
}
