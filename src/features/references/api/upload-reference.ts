import { useMutation, useQueryClient } from '@tanstack/react-query';
import { REFERENCE_FIELDS } from '../../../shared/references';
import { apiErrorFrom, csrfTokenForUpload } from '../../../lib/api-client';
import { referenceKeys } from '../../../lib/query-keys';

export interface ReferenceUpload {
  name: string;
  structure: File;
  trajectory: File | null;
  selection: string;
}

/** Multipart upload over XMLHttpRequest, the one browser API that reports upload progress. */
export async function uploadReference(moleculeId: number, u: ReferenceUpload, onProgress: (fraction: number) => void): Promise<void> {
  const form = new FormData();
  if (u.name.trim()) form.append(REFERENCE_FIELDS.name, u.name.trim());
  if (u.selection.trim()) form.append(REFERENCE_FIELDS.selection, u.selection.trim());
  form.append(REFERENCE_FIELDS.structure, u.structure);
  if (u.trajectory) form.append(REFERENCE_FIELDS.trajectory, u.trajectory);
  const token = await csrfTokenForUpload();
  await new Promise<void>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/molecules/${moleculeId}/references`);
    xhr.setRequestHeader('x-csrf-token', token);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onload = () => (xhr.status === 202 ? resolve() : reject(apiErrorFrom(xhr.status, xhr.responseText)));
    xhr.onerror = () => reject(apiErrorFrom(0, ''));
    xhr.send(form);
  });
}

export function useUploadReference(moleculeId: number, onProgress: (fraction: number) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (u: ReferenceUpload) => uploadReference(moleculeId, u, onProgress),
    onSettled: () => queryClient.invalidateQueries({ queryKey: referenceKeys.ofMolecule(moleculeId) }),
  });
}
