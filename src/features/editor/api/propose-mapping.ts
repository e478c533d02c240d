import { useMutation } from '@tanstack/react-query';
import type { ProposalBody, ProposalsResponse } from '../../../shared/proposals';
import { api } from '../../../lib/api-client';

/** Asks the server for proposals for a mapping's draft (nothing is written, so nothing to invalidate). */
export const proposeMapping = (mappingId: number, body: ProposalBody) => api.post<ProposalsResponse>(`/api/mappings/${mappingId}/proposal`, body);

export function useProposeMapping(mappingId: number) {
  return useMutation({ mutationFn: (body: ProposalBody) => proposeMapping(mappingId, body) });
}
