import { useMutation, useQueryClient } from '@tanstack/react-query';
import { UPLOAD_FIELD, type UploadResponse } from '../../../shared/molecules';
import { api, isApiError } from '../../../lib/api-client';
import { projectKeys } from '../../../lib/query-keys';

/**
 * A molfile or SDF, one molecule per record. When no record imports (422), the per-record results still
 * come back. `allowDuplicate` adds records whose structure the project already has.
 */
export async function uploadMolecules(projectId: number, file: File, allowDuplicate = false): Promise<UploadResponse> {
  const form = new FormData();
  form.append(UPLOAD_FIELD, file);
  if (allowDuplicate) form.append('allowDuplicate', 'true');
  try {
    return await api.postForm<UploadResponse>(`/api/projects/${projectId}/molecules/upload`, form);
  } catch (error) {
    const details = isApiError(error) ? (error.details as Partial<UploadResponse> | undefined) : undefined;
    if (details?.records) return { records: details.records, created: 0, failed: details.records.length };
    throw error;
  }
}

export function useUploadMolecules(projectId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, allowDuplicate }: { file: File; allowDuplicate?: boolean }) => uploadMolecules(projectId, file, allowDuplicate),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: projectKeys.detail(projectId) }),
  });
}
