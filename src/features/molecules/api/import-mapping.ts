import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ImportOutcome, ImportPreview } from '../../../shared/exports';
import type { MappingSummary } from '../../../shared/mappings';
import { api } from '../../../lib/api-client';
import { moleculeKeys } from '../../../lib/query-keys';

/** The parsed JSON export as read from the file; the server validates it (shared importBody). */
export type ImportFile = Record<string, unknown>;

export const previewImport = (moleculeId: number, file: ImportFile) => api.post<ImportPreview>(`/api/molecules/${moleculeId}/mappings/import`, { ...file, preview: true });

export const importMapping = (moleculeId: number, file: ImportFile, allowModified: boolean) =>
  api.post<MappingSummary & { import: ImportOutcome }>(`/api/molecules/${moleculeId}/mappings/import`, { ...file, preview: false, ...(allowModified ? { allowModified: true } : {}) });

export function usePreviewImport(moleculeId: number) {
  return useMutation({ mutationFn: (file: ImportFile) => previewImport(moleculeId, file) });
}

export function useImportMapping(moleculeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, allowModified }: { file: ImportFile; allowModified: boolean }) => importMapping(moleculeId, file, allowModified),
    // The molecule's mapping list lives under its key.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: moleculeKeys.detail(moleculeId) }),
  });
}
