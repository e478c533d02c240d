import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditEntry } from '../../../shared/audit';
import { api } from '../../../lib/api-client';
import { versionKeys } from '../../../lib/query-keys';

export const getAudit = (mappingId: number) => api.get<AuditEntry[]>(`/api/mappings/${mappingId}/audit`);

export const auditQueryOptions = (mappingId: number) => queryOptions({ queryKey: versionKeys.audit(mappingId), queryFn: () => getAudit(mappingId) });

export function useAudit(mappingId: number) {
  return useQuery(auditQueryOptions(mappingId));
}
