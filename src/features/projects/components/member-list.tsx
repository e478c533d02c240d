import { ErrorAlert } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/loading';
import { useMembers } from '../api/get-members';
import { MemberRow } from './member-row';

interface MemberListProps {
  projectId: number;
  currentUserId: number;
  canManage: boolean;
}

export function MemberList({ projectId, currentUserId, canManage }: MemberListProps) {
  const members = useMembers(projectId);

  if (members.isPending) return <Loading label="Loading members…" />;
  if (members.isError) return <ErrorAlert error={members.error} />;

  return (
    <ul aria-label="Members" className="divide-y divide-paper-200">
      {members.data.map((member) => (
        <MemberRow
          key={member.userId}
          projectId={projectId}
          member={member}
          isSelf={member.userId === currentUserId}
          canManage={canManage}
        />
      ))}
    </ul>
  );
}
