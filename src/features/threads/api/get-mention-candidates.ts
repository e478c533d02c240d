import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Member } from '../../../shared/projects';
import { api } from '../../../lib/api-client';
import { projectKeys } from '../../../lib/query-keys';

export interface MentionCandidate {
  userId: number;
  displayName: string;
  email: string;
}

// The project's members, for the @ autocomplete (GET /api/projects/:id/members).
export async function getMentionCandidates(projectId: number): Promise<MentionCandidate[]> {
  const members = await api.get<Member[]>(`/api/projects/${projectId}/members`);
  return members.map((m) => ({ userId: m.userId, displayName: m.displayName, email: m.email }));
}

export const mentionCandidatesQueryOptions = (projectId: number) =>
  queryOptions({ queryKey: projectKeys.mentionCandidates(projectId), queryFn: () => getMentionCandidates(projectId), staleTime: 60_000 });

export function useMentionCandidates(projectId: number) {
  return useQuery(mentionCandidatesQueryOptions(projectId));
}
